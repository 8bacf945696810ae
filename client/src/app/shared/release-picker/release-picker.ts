import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { startWith, switchMap } from 'rxjs';

import { LATEST, ReleaseContext } from '../../core/release-context';

/** Select for a published release (or the newest one), bound to a typed form control. */
@Component({
  selector: 'thalpos-release-picker',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatSelect, MatOption],
  template: `
    <mat-form-field>
      <mat-label>{{ label() }}</mat-label>
      <mat-select [formControl]="control()" [aria-label]="label()">
        <mat-option [value]="latest">Newest ({{ context.latest() }})</mat-option>
        @for (release of context.releases(); track release.version) {
          <mat-option [value]="release.version">{{ release.version }}</mat-option>
        }
        @if (unlisted(); as version) {
          <mat-option [value]="version">{{ version }}</mat-option>
        }
      </mat-select>
      @if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
    </mat-form-field>
  `,
  styles: `
    :host {
      display: inline-block;
      width: 11rem;
    }
    mat-form-field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReleasePicker {
  protected readonly context = inject(ReleaseContext);

  readonly control = input.required<FormControl<string>>();
  readonly hint = input('');
  /** Visible label and accessible name, e.g. "From release" when a screen shows two pickers. */
  readonly label = input('Release');

  protected readonly latest = LATEST;

  private readonly value = toSignal(
    toObservable(this.control).pipe(
      switchMap((control) => control.valueChanges.pipe(startWith(control.value))),
    ),
    { initialValue: LATEST },
  );

  /** A version from a link that is not (or not yet) in the list, kept selectable as written. */
  protected readonly unlisted = computed(() => {
    const value = this.value();
    if (value === LATEST) return null;
    return this.context.releases().some((r) => r.version === value) ? null : value;
  });
}
