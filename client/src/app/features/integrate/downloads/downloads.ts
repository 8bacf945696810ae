import { ChangeDetectionStrategy, Component, effect, inject } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl } from '@angular/forms';
import { MatIcon } from '@angular/material/icon';
import { catchError, filter, map, of, startWith, switchMap } from 'rxjs';

import { ReleaseContext } from '../../../core/release-context';
import { ReleasePicker } from '../../../shared/release-picker/release-picker';
import { IntegrateApi, type ExportFile } from '../integrate-api';

const FORMATS = [
  { format: 'csv', label: 'CSV', use: 'spreadsheets and property packages' },
  { format: 'json', label: 'JSON', use: 'programs (with a published JSON Schema)' },
  { format: 'xml', label: 'XML', use: 'simulators that read XML' },
] as const;

/** Integrate → Downloads: a release's exports, with their SHA-256 checksums when listed. */
@Component({
  selector: 'thalpos-downloads',
  imports: [MatIcon, ReleasePicker],
  template: `
    <thalpos-release-picker [control]="version" />
    <ul class="files" aria-label="Export files">
      @for (f of formats; track f.format) {
        @let file = checksums()?.[f.format];
        <li>
          <a class="file" [href]="href(f.format)" download>
            <mat-icon aria-hidden="true">download</mat-icon>
            {{ chosen() || 'latest' }}.{{ f.format }}
          </a>
          <span class="use">{{ f.label }}, for {{ f.use }}</span>
          @if (file) {
            <code class="sha" [attr.aria-label]="'SHA-256 of the ' + f.label + ' export'"
              >SHA-256 {{ file.sha256 }}</code
            >
          }
        </li>
      }
    </ul>
    @if (!checksums()) {
      <p class="help">Checksums appear here once the release lists them.</p>
    } @else {
      <p class="help">
        Check a download with <code>sha256sum</code> (or <code>Get-FileHash</code>): the result must
        equal the checksum shown.
      </p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    thalpos-release-picker {
      margin-bottom: 8px;
    }
    .files {
      list-style: none;
      margin: 0 0 8px;
      padding: 0;
      display: flex;
      flex-direction: column;
      gap: 12px;
    }
    li {
      display: flex;
      flex-direction: column;
    }
    .file {
      display: inline-flex;
      align-items: center;
      gap: 6px;
      font-weight: 500;
    }
    .use,
    .help {
      color: var(--mat-sys-on-surface-variant);
    }
    .sha {
      font: var(--mat-sys-body-small);
      font-family: monospace;
      overflow-wrap: anywhere;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Downloads {
  private readonly api = inject(IntegrateApi);
  private readonly releases = inject(ReleaseContext);

  protected readonly formats = FORMATS;
  protected readonly version = new FormControl('', { nonNullable: true });

  protected readonly chosen = toSignal(this.version.valueChanges, { initialValue: '' });

  /** The chosen release's export checksums; null while unknown or not listed. */
  protected readonly checksums = toSignal(
    toObservable(this.chosen).pipe(
      filter((v) => v !== ''),
      switchMap((v) =>
        this.api.manifest(v).pipe(
          map((m) => m.exports ?? null),
          catchError(() => of(null)),
          startWith(null),
        ),
      ),
    ),
    { initialValue: null as Partial<Record<string, ExportFile>> | null },
  );

  constructor() {
    effect(() => {
      const newest = this.releases.releases()[0];
      if (newest && !this.version.value) this.version.setValue(newest.version);
    });
  }

  protected href(format: string): string {
    return `/api/v1/releases/${encodeURIComponent(this.chosen() || 'latest')}/export.${format}`;
  }
}
