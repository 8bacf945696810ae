import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import type { Subscription } from 'rxjs';

import type { UploadCreated, UploadPreview as Preview } from '@contracts/uploads/uploads-schemas';
import { ApiError, readableMessage } from '../../../../core/api-error';
import { UploadApi, type UploadProgress } from '../upload-api';
import { UploadPreview } from '../upload-preview/upload-preview';

type Stage =
  | { readonly kind: 'idle' }
  | { readonly kind: 'sending'; readonly percent: number | null; readonly saving: boolean }
  | { readonly kind: 'processing'; readonly saving: boolean }
  | { readonly kind: 'previewed' }
  | { readonly kind: 'created'; readonly created: UploadCreated }
  | { readonly kind: 'failed'; readonly message: string };

const MAX_BYTES = 10 * 1024 * 1024;

/**
 * Bulk upload: choose or drop a CSV or XML file, see the dry run's rows with their errors, and
 * submit a clean file as one draft proposal. The format is imports/README.md's "Proposal upload".
 */
@Component({
  selector: 'thalpos-upload-page',
  imports: [
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatFormField,
    MatLabel,
    MatHint,
    MatInput,
    MatIcon,
    MatProgressBar,
    UploadPreview,
  ],
  templateUrl: './upload-page.html',
  styleUrl: './upload-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadPage {
  private readonly api = inject(UploadApi);
  private running: Subscription | null = null;

  protected readonly file = signal<File | null>(null);
  protected readonly stage = signal<Stage>({ kind: 'idle' });
  protected readonly preview = signal<Preview | null>(null);
  protected readonly dragging = signal(false);
  protected readonly rationale = new FormControl('', { nonNullable: true });

  protected readonly busy = computed(() => {
    const kind = this.stage().kind;
    return kind === 'sending' || kind === 'processing';
  });
  /** Submitting is offered only for the file whose dry run came back clean. */
  protected readonly canSubmit = computed(
    () => this.preview()?.ok === true && this.stage().kind === 'previewed',
  );

  protected chosen(event: Event): void {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (file) this.check(file);
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(true);
  }

  protected dropped(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files?.[0];
    if (file) this.check(file);
  }

  /** Dry run: nothing is saved. */
  protected check(file: File): void {
    this.file.set(file);
    this.preview.set(null);
    if (file.size > MAX_BYTES) {
      this.stage.set({
        kind: 'failed',
        message: `${file.name} is larger than 10 MB; split it into several uploads.`,
      });
      return;
    }
    this.run(this.api.dryRun(file), false);
  }

  protected submit(): void {
    const file = this.file();
    if (file === null || !this.canSubmit()) return;
    this.run(this.api.submit(file, this.rationale.value), true);
  }

  private run(progress: ReturnType<UploadApi['dryRun']>, saving: boolean): void {
    this.running?.unsubscribe();
    this.stage.set({ kind: 'sending', percent: 0, saving });
    this.running = progress.subscribe({
      next: (p: UploadProgress) => {
        if (p.stage === 'sending') this.stage.set({ kind: 'sending', percent: p.percent, saving });
        else if (p.stage === 'processing') this.stage.set({ kind: 'processing', saving });
        else if (p.stage === 'preview') {
          this.preview.set(p.preview);
          this.stage.set({ kind: 'previewed' });
        } else this.stage.set({ kind: 'created', created: p.created });
      },
      error: (error: unknown) => {
        // A refused submit carries the rows at fault: show them like a dry run.
        if (error instanceof ApiError && error.code === 'invalid_rows' && 'rows' in error.details)
          this.preview.set({ ...(error.details as unknown as Preview), ok: false });
        this.stage.set({ kind: 'failed', message: readableMessage(error) });
      },
    });
  }
}
