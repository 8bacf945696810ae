import { ChangeDetectionStrategy, Component, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatCard, MatCardContent, MatCardHeader, MatCardTitle } from '@angular/material/card';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatSlideToggle, type MatSlideToggleChange } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';

import type { SettingsAnswer } from '@contracts/users/users-schemas';

import { readableMessage } from '../../../core/api-error';
import { SettingsApi } from '../settings-api';

/** Settings: whether Thalpos e-mails the user about proposals; saved as soon as it is switched. */
@Component({
  selector: 'thalpos-settings-page',
  imports: [
    MatButton,
    MatCard,
    MatCardContent,
    MatCardHeader,
    MatCardTitle,
    MatIcon,
    MatProgressBar,
    MatSlideToggle,
  ],
  templateUrl: './settings-page.html',
  styleUrl: './settings-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SettingsPage {
  private readonly api = inject(SettingsApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly destroyRef = inject(DestroyRef);

  protected readonly settings = signal<SettingsAnswer | null>(null);
  protected readonly loading = signal(true);
  protected readonly saving = signal(false);
  protected readonly loadError = signal<string | null>(null);

  constructor() {
    this.load();
  }

  protected load(): void {
    this.loading.set(true);
    this.loadError.set(null);
    this.api
      .read()
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (settings) => {
          this.settings.set(settings);
          this.loading.set(false);
        },
        error: (error: unknown) => {
          this.loadError.set(readableMessage(error));
          this.loading.set(false);
        },
      });
  }

  protected setEmailNotifications(change: MatSlideToggleChange): void {
    const stored = this.settings();
    if (!stored) return;
    this.saving.set(true);
    this.api
      .update({ emailNotifications: change.checked })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (settings) => {
          this.settings.set(settings);
          this.saving.set(false);
          this.snackBar.open(
            settings.emailNotifications
              ? 'E-mail notifications are on'
              : 'E-mail notifications are off',
            undefined,
            { duration: 4000 },
          );
        },
        error: (error: unknown) => {
          // The switch goes back to what the server holds.
          change.source.checked = stored.emailNotifications;
          this.saving.set(false);
          this.snackBar.open(`Setting not saved: ${readableMessage(error)}`, 'Dismiss', {
            duration: 10000,
          });
        },
      });
  }
}
