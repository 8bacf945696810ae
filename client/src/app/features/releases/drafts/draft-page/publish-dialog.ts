import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButton } from '@angular/material/button';
import {
  MAT_DIALOG_DATA,
  MatDialogActions,
  MatDialogClose,
  MatDialogContent,
  MatDialogTitle,
} from '@angular/material/dialog';

export interface PublishDialogData {
  readonly version: string;
  readonly base: string | null;
  readonly included: number;
  readonly leftOut: number;
  readonly acknowledged: number;
}

/** Asks once more before a release is published: publishing cannot be undone. */
@Component({
  selector: 'thalpos-publish-dialog',
  imports: [MatButton, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle],
  template: `
    <h2 mat-dialog-title>Publish release {{ data.version }}?</h2>
    <mat-dialog-content>
      <p>
        {{ data.included }} {{ data.included === 1 ? 'change' : 'changes' }} to
        {{ data.base ?? 'an empty registry' }}
        @if (data.leftOut > 0) {
          ({{ data.leftOut }} left out for a later release)
        }
        will be pinned, and the release frozen. A published release never changes: a mistake needs a
        new release.
      </p>
      @if (data.acknowledged > 0) {
        <p>
          {{ data.acknowledged }} acknowledged stale derived
          {{ data.acknowledged === 1 ? 'value is' : 'values are' }} published as they are.
        </p>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button matButton type="button" [mat-dialog-close]="false">Cancel</button>
      <button matButton="filled" type="button" [mat-dialog-close]="true">Publish</button>
    </mat-dialog-actions>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PublishDialog {
  protected readonly data = inject<PublishDialogData>(MAT_DIALOG_DATA);
}
