import { CdkCopyToClipboard } from '@angular/cdk/clipboard';
import { DatePipe, DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatTooltip } from '@angular/material/tooltip';
import { RouterLink } from '@angular/router';
import { catchError, map, of, startWith, switchMap } from 'rxjs';

import type {
  ReleaseManifestWithExports,
  ReleaseSummary,
} from '@contracts/releases/releases-schemas';
import { readableMessage } from '../../../core/api-error';
import { ReleasesApi } from '../releases-api';

type Manifest =
  | { readonly state: 'loading' }
  | { readonly state: 'loaded'; readonly manifest: ReleaseManifestWithExports }
  | { readonly state: 'failed'; readonly message: string };

const FORMATS = [
  { key: 'csv', label: 'CSV' },
  { key: 'json', label: 'JSON' },
  { key: 'xml', label: 'XML' },
] as const;

/** One published release: who published it and when, its notes, counts and downloads. */
@Component({
  selector: 'thalpos-release-card',
  imports: [
    DatePipe,
    DecimalPipe,
    RouterLink,
    CdkCopyToClipboard,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
    MatTooltip,
  ],
  templateUrl: './release-card.html',
  styleUrl: './release-card.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReleaseCard {
  private readonly api = inject(ReleasesApi);

  readonly release = input.required<ReleaseSummary>();
  /** The release published before this one, to compare against; null for the first. */
  readonly previous = input<string | null>(null);
  readonly newest = input(false);

  protected readonly formats = FORMATS;
  /** The format whose checksum was copied last, for a moment's confirmation. */
  protected readonly copied = signal<string | null>(null);

  protected readonly manifest = toSignal(
    toObservable(computed(() => this.release().version)).pipe(
      switchMap((version) =>
        this.api.manifest(version).pipe(
          map((manifest): Manifest => ({ state: 'loaded', manifest })),
          catchError((error: unknown) =>
            of<Manifest>({ state: 'failed', message: readableMessage(error) }),
          ),
          startWith<Manifest>({ state: 'loading' }),
        ),
      ),
    ),
    { initialValue: { state: 'loading' } as Manifest },
  );

  protected wasCopied(format: string, ok: boolean): void {
    this.copied.set(ok ? format : null);
  }
}
