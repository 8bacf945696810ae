import { Clipboard } from '@angular/cdk/clipboard';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';

export interface TokenCreatedData {
  name: string;
  token: string;
}

/** Shows a new token once, with a copy button; after closing, only its prefix remains visible. */
@Component({
  selector: 'thalpos-token-created-dialog',
  imports: [MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose, MatButton, MatIcon],
  template: `
    <h2 mat-dialog-title>Token “{{ data.name }}” created</h2>
    <mat-dialog-content>
      <p class="warning" role="alert">
        <mat-icon aria-hidden="true">warning</mat-icon>
        Copy it now: you will not see it again. Store it like a password.
      </p>
      <code class="token" data-testid="new-token" tabindex="0">{{ data.token }}</code>
      <p class="use">
        Send it as <code>Authorization: Bearer &lt;token&gt;</code> with every API request.
      </p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton="outlined" type="button" (click)="copy()">
        <mat-icon>{{ copied() ? 'check' : 'content_copy' }}</mat-icon>
        {{ copied() ? 'Copied' : 'Copy token' }}
      </button>
      <button matButton="filled" type="button" mat-dialog-close>Done</button>
    </mat-dialog-actions>
  `,
  styles: `
    .warning {
      display: flex;
      align-items: center;
      gap: 8px;
      padding: 8px 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    .token {
      display: block;
      padding: 12px;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-surface-container-high);
      overflow-wrap: anywhere;
      user-select: all;
    }
    .use {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class TokenCreatedDialog {
  protected readonly data = inject<TokenCreatedData>(MAT_DIALOG_DATA);
  private readonly clipboard = inject(Clipboard);
  protected readonly copied = signal(false);

  protected copy(): void {
    this.copied.set(this.clipboard.copy(this.data.token));
  }
}
