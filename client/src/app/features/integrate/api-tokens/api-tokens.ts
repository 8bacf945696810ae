import { DatePipe } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  DestroyRef,
  inject,
  signal,
  viewChild,
} from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import {
  FormControl,
  FormGroup,
  FormGroupDirective,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { filter, switchMap } from 'rxjs';

import type { TokenView } from '@contracts/tokens/tokens-schemas';
import { readableMessage } from '../../../core/api-error';
import { ConfirmDialog, type ConfirmData } from '../confirm-dialog/confirm-dialog';
import { IntegrateApi } from '../integrate-api';
import {
  TokenCreatedDialog,
  type TokenCreatedData,
} from '../token-created-dialog/token-created-dialog';

/** Integrate → API tokens: create one (shown once), see when each was last used, revoke. */
@Component({
  selector: 'thalpos-api-tokens',
  imports: [
    DatePipe,
    ReactiveFormsModule,
    MatButton,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatIcon,
    MatProgressBar,
  ],
  templateUrl: './api-tokens.html',
  styleUrl: './api-tokens.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ApiTokens {
  private readonly api = inject(IntegrateApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  // Not `required`: an emptied field after a token was made is no error; only an empty submit is.
  protected readonly name = new FormControl('', {
    nonNullable: true,
    validators: [Validators.maxLength(100)],
  });
  protected readonly form = new FormGroup({ name: this.name });
  private readonly formDirective = viewChild.required(FormGroupDirective);
  protected readonly tokens = signal<readonly TokenView[]>([]);
  protected readonly loading = signal(true);
  protected readonly loadError = signal<string | null>(null);
  protected readonly creating = signal(false);

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.loadError.set(null);
    this.api
      .listTokens()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (tokens) => {
          this.tokens.set(tokens);
          this.loading.set(false);
        },
        error: (error: unknown) => {
          this.loadError.set(readableMessage(error));
          this.loading.set(false);
        },
      });
  }

  protected create(): void {
    const name = this.name.value.trim();
    if (this.creating()) return;
    if (!name) {
      this.name.setErrors({ required: true });
      this.name.markAsTouched();
      return;
    }
    this.creating.set(true);
    this.api
      .createToken(name)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: ({ token, apiToken }) => {
          this.creating.set(false);
          // Also clears "submitted", so the emptied field does not show as an error.
          this.formDirective().resetForm();
          this.tokens.update((list) => [...list, apiToken]);
          this.dialog.open<TokenCreatedDialog, TokenCreatedData>(TokenCreatedDialog, {
            data: { name: apiToken.name, token },
            disableClose: true,
            maxWidth: '36rem',
          });
        },
        error: (error: unknown) => {
          this.creating.set(false);
          this.snackBar.open(`Token not created: ${readableMessage(error)}`, 'Dismiss', {
            duration: 10000,
          });
        },
      });
  }

  protected revoke(token: TokenView): void {
    this.dialog
      .open<ConfirmDialog, ConfirmData, boolean>(ConfirmDialog, {
        data: {
          title: `Revoke “${token.name}”?`,
          message: `Programs using ${token.prefix}… will be refused from now on. This cannot be undone.`,
          confirm: 'Revoke',
        },
      })
      .afterClosed()
      .pipe(
        filter((confirmed) => confirmed === true),
        switchMap(() => this.api.revokeToken(token.id)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: () => {
          this.tokens.update((list) => list.filter((t) => t.id !== token.id));
          this.snackBar.open(`Token “${token.name}” revoked`, undefined, { duration: 5000 });
        },
        error: (error: unknown) =>
          this.snackBar.open(`Token not revoked: ${readableMessage(error)}`, 'Dismiss', {
            duration: 10000,
          }),
      });
  }
}
