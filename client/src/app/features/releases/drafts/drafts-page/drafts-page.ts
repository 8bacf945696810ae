import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { Router, RouterLink } from '@angular/router';

import type { DraftView } from '@contracts/releases/release-drafts-schemas';
import { readableMessage } from '../../../../core/api-error';
import { DraftsApi } from '../drafts-api';
import { publishProblem } from '../draft-words';

/** The same pattern the server checks (schema/releases.ts). */
const VERSION = /^[0-9]{4}\.[0-9]{1,3}(-[a-z0-9]+)?$/;

/** Release drafts: start a new release, or open a draft in progress. */
@Component({
  selector: 'thalpos-drafts-page',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    RouterLink,
    MatButton,
    MatError,
    MatFormField,
    MatHint,
    MatIcon,
    MatInput,
    MatLabel,
    MatProgressBar,
  ],
  templateUrl: './drafts-page.html',
  styleUrl: './drafts-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DraftsPage {
  private readonly api = inject(DraftsApi);
  private readonly router = inject(Router);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly drafts = signal<readonly DraftView[] | null>(null);
  protected readonly loadError = signal<string | null>(null);
  protected readonly createError = signal<string | null>(null);
  protected readonly creating = signal(false);

  protected readonly form = new FormGroup({
    version: new FormControl('', {
      nonNullable: true,
      validators: [Validators.required, Validators.pattern(VERSION)],
    }),
    notes: new FormControl('', { nonNullable: true, validators: [Validators.maxLength(20000)] }),
  });

  constructor() {
    this.api
      .list()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ drafts }) => this.drafts.set(drafts),
        error: (error: unknown) => this.loadError.set(readableMessage(error)),
      });
  }

  protected create(): void {
    if (this.form.invalid || this.creating()) {
      this.form.markAllAsTouched();
      return;
    }
    this.creating.set(true);
    this.createError.set(null);
    const { version, notes } = this.form.getRawValue();
    this.api
      .create({ version: version.trim(), notes })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (draft) => void this.router.navigate(['/releases/drafts', draft.release.version]),
        error: (error: unknown) => {
          this.creating.set(false);
          this.createError.set(publishProblem(error));
        },
      });
  }
}
