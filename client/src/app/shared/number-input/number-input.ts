import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { ErrorStateMatcher } from '@angular/material/core';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { map, startWith, switchMap } from 'rxjs';

/** Refusals show while typing, not only after the field is left. */
const showWhileTyping: ErrorStateMatcher = {
  isErrorState: (control) => !!control && control.invalid && (control.dirty || control.touched),
};

/**
 * A number field: plain text (so nothing is dropped by the browser's own number parsing),
 * read by {@link readNumber} through the {@link numberText} validator, whose message it shows.
 */
@Component({
  selector: 'thalpos-number-input',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatInput, MatHint, MatError],
  template: `
    <mat-form-field class="field">
      <mat-label>{{ label() }}</mat-label>
      <input
        matInput
        type="text"
        inputmode="decimal"
        autocomplete="off"
        spellcheck="false"
        [formControl]="control()"
        [errorStateMatcher]="matcher"
        [attr.aria-label]="ariaLabel() || label()"
      />
      @if (hint()) {
        <mat-hint>{{ hint() }}</mat-hint>
      }
      <mat-error>{{ message() }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: block;
    }
    .field {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NumberInput {
  readonly control = input.required<FormControl<string>>();
  readonly label = input.required<string>();
  /** Accessible name when the visible label is too short, e.g. "Step 2 ΔH". */
  readonly ariaLabel = input<string>('');
  readonly hint = input<string>('');

  protected readonly matcher = showWhileTyping;

  private readonly errors = toSignal(
    toObservable(this.control).pipe(
      switchMap((control) =>
        control.statusChanges.pipe(
          startWith(control.status),
          map(() => control.errors),
        ),
      ),
    ),
    { initialValue: null },
  );

  protected readonly message = computed(() => {
    const errors = this.errors();
    const number = errors?.['number'] as { message?: string } | undefined;
    return number?.message ?? (errors ? 'Enter a number.' : '');
  });
}
