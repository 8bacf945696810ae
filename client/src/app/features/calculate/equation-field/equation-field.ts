import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { startWith, switchMap } from 'rxjs';

import { CalculateApi } from '../calculate-api';
import { checkEquation, EMPTY_CHECK, signed } from '../equation-check';

/** An equation input that shows, as the user types, whether the server can read and balance it. */
@Component({
  selector: 'thalpos-equation-field',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatInput, MatHint, MatError, MatIcon],
  templateUrl: './equation-field.html',
  styleUrl: './equation-field.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EquationField {
  private readonly api = inject(CalculateApi);

  readonly control = input.required<FormControl<string>>();
  /** Visible label and accessible name, e.g. "Target equation" or "Step 2 equation". */
  readonly label = input.required<string>();

  protected readonly check = toSignal(
    toObservable(this.control).pipe(
      switchMap((control) => control.valueChanges.pipe(startWith(control.value))),
      checkEquation((equation) => this.api.parseEquation(equation)),
    ),
    { initialValue: EMPTY_CHECK },
  );

  protected readonly imbalanceText = computed(() => {
    const check = this.check();
    if (check.state !== 'unbalanced') return '';
    const parts = check.imbalance.map(({ element, excess }) => `${element} ${signed(excess)}`);
    if (check.parsed.charge !== 0) parts.push(`charge ${signed(check.parsed.charge)}`);
    return parts.join(', ');
  });
}
