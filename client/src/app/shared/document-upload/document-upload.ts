import { HttpEventType } from '@angular/common/http';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  inject,
  input,
  output,
  signal,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { Subscription } from 'rxjs';

import type { DocumentView } from '@contracts/sources/sources-schemas';
import { readableMessage } from '../../core/api-error';
import { SourcesApi } from '../sources-api';

/** The server's limit; checked here first so nobody waits for a refusal. */
export const MAX_PDF_BYTES = 20 * 1024 * 1024;

/**
 * Attaches a PDF to a source, with a progress bar while it uploads. The server checks the bytes
 * (a file merely named .pdf is refused); editors, admins and the uploader may read it later.
 *
 *   <thalpos-document-upload [sourceId]="id" (uploaded)="documents.reload()" />
 */
@Component({
  selector: 'thalpos-document-upload',
  imports: [MatButton, MatIcon, MatProgressBar],
  template: `
    <input
      #picker
      type="file"
      accept="application/pdf,.pdf"
      class="file"
      (change)="send(picker.files?.item(0) ?? null); picker.value = ''"
    />
    <button
      matButton="outlined"
      type="button"
      [disabled]="!sourceId() || progress() !== null"
      (click)="picker.click()"
    >
      <mat-icon>upload_file</mat-icon>
      Attach a PDF
    </button>
    <span class="limit">At most 20 MB.</span>
    @let p = progress();
    @if (p !== null) {
      <mat-progress-bar mode="determinate" [value]="p" aria-label="Uploading the document" />
      <span class="state">Uploading {{ fileName() }} … {{ p }}%</span>
    }
    @if (done(); as name) {
      <p class="state" role="status">{{ name }} attached.</p>
    }
    @if (problem(); as message) {
      <p class="problem" role="alert">{{ message }}</p>
    }
  `,
  styles: `
    :host {
      display: flex;
      flex-wrap: wrap;
      align-items: center;
      gap: 0.5rem 1rem;
    }
    .file {
      display: none;
    }
    mat-progress-bar {
      flex-basis: 100%;
    }
    .limit,
    .state {
      color: var(--mat-sys-on-surface-variant);
    }
    .problem {
      color: var(--mat-sys-error);
      flex-basis: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DocumentUpload {
  private readonly api = inject(SourcesApi);
  private readonly destroyRef = inject(DestroyRef);

  /** The source the document belongs to. */
  readonly sourceId = input.required<string | null>();
  /** The stored document, once the server has it. */
  readonly uploaded = output<DocumentView>();

  /** Percent sent, or null when nothing is uploading. */
  protected readonly progress = signal<number | null>(null);
  protected readonly fileName = signal('');
  protected readonly done = signal<string | null>(null);
  protected readonly problem = signal<string | null>(null);
  private running: Subscription | null = null;

  send(file: File | null): void {
    const sourceId = this.sourceId();
    if (!file || !sourceId) return;
    this.done.set(null);
    this.problem.set(null);
    if (file.size > MAX_PDF_BYTES) {
      this.problem.set(`${file.name} is larger than 20 MB; documents may be at most 20 MB.`);
      return;
    }
    this.fileName.set(file.name);
    this.progress.set(0);
    this.running?.unsubscribe();
    this.running = this.api
      .upload(sourceId, file)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (event) => {
          if (event.type === HttpEventType.UploadProgress) {
            this.progress.set(event.total ? Math.round((100 * event.loaded) / event.total) : 0);
          } else if (event.type === HttpEventType.Response && event.body) {
            this.progress.set(null);
            this.done.set(event.body.fileName);
            this.uploaded.emit(event.body);
          }
        },
        error: (error: unknown) => {
          this.progress.set(null);
          this.problem.set(readableMessage(error));
        },
      });
  }
}
