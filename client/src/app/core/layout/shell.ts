import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatChip, MatChipSet } from '@angular/material/chips';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatToolbar } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive } from '@angular/router';

import { readableMessage } from '../api-error';
import { Session, SIGN_IN_URL } from '../session';

/** Top bar (product name, navigation, who is signed in) around the routed screen. */
@Component({
  selector: 'thalpos-shell',
  imports: [MatToolbar, MatButton, MatIcon, MatChipSet, MatChip, RouterLink, RouterLinkActive],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  protected readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly signInUrl = SIGN_IN_URL;
  protected readonly signingOut = signal(false);

  protected async signOut(): Promise<void> {
    this.signingOut.set(true);
    try {
      await this.session.signOut();
      await this.router.navigateByUrl('/');
    } catch (error) {
      this.snackBar.open(`Sign-out failed: ${readableMessage(error)}`, 'Dismiss', {
        duration: 8000,
      });
    } finally {
      this.signingOut.set(false);
    }
  }
}
