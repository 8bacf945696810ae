import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { CdkTextareaAutosize } from '@angular/cdk/text-field';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { startWith, switchMap } from 'rxjs';

import { ChemText } from '../../../shared/chem-text';
import { checkEquation, EMPTY_CHECK, signed, termsWithoutPhase } from '../equation-check';
import { EquationChecker } from '../equation-checker';
import { exactValue } from '../exact-number';

/**
 * An equation input that shows, as the user types, whether the server can read and balance it.
 * The text stays plain as typed; what the server read back is shown with real subscripts.
 */
@Component({
  selector: 'thalpos-equation-field',
  imports: [
    ReactiveFormsModule,
    CdkTextareaAutosize,
    MatFormField,
    MatLabel,
    MatInput,
    MatHint,
    MatError,
    MatIcon,
    ChemText,
  ],
  templateUrl: './equation-field.html',
  styleUrl: './equation-field.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EquationField {
  private readonly checker = inject(EquationChecker);

  readonly control = input.required<FormControl<string>>();
  /** Visible label and accessible name, e.g. "Target equation" or "Step 2 equation". */
  readonly label = input.required<string>();
  /**
   * Every term must carry its phase (the Hess screen: no registry to resolve one from, and the
   * phase changes ΔH, e.g. water).
   */
  readonly requirePhases = input(false);

  /** Hints are announced only for the field being edited, not all at once when a form fills. */
  protected readonly focused = signal(false);

  protected readonly check = toSignal(
    toObservable(this.control).pipe(
      switchMap((control) => control.valueChanges.pipe(startWith(control.value))),
      checkEquation((equation) => this.checker.check(equation)),
    ),
    { initialValue: EMPTY_CHECK },
  );

  /** Terms missing their phase, when phases are required and the equation was read. */
  protected readonly unphased = computed(() => {
    const check = this.check();
    if (!this.requirePhases() || !('parsed' in check)) return [];
    return termsWithoutPhase(check.parsed);
  });

  protected readonly imbalanceText = computed(() => {
    const check = this.check();
    if (check.state !== 'unbalanced') return '';
    const parts = check.imbalance.map(({ element, excess }) => `${element} ${signed(excess)}`);
    const charge = check.parsed.charge;
    if (exactValue(charge) !== 0) parts.push(`charge ${signed(charge)}`);
    return parts.join(', ');
  });

  /**
   * Readings worth a second look that the server adds to an answer, e.g. "did you mean Fe^2+?"
   * for `Fe2+` (read as Fe₂ with charge +1).
   */
  protected readonly hints = computed(() => {
    const check = this.check();
    if (!('parsed' in check)) return [];
    const hints: unknown = (check.parsed as { hints?: unknown }).hints;
    return Array.isArray(hints)
      ? hints
          .map((h) => (typeof h === 'string' ? h : (h as { message?: unknown })?.message))
          .filter((h): h is string => typeof h === 'string')
      : [];
  });

  /** The checked text split around the character at fault, to highlight it. */
  protected readonly fault = computed(() => {
    const check = this.check();
    if (check.state !== 'invalid' || check.position === null) return null;
    const { text, position } = check;
    return {
      before: text.slice(0, position),
      at: text.slice(position, position + 1) || ' ',
      after: text.slice(position + 1),
      character: position + 1,
    };
  });

  /** Enter submits the form rather than breaking the equation over two lines. */
  protected submitOnEnter(event: Event): void {
    event.preventDefault();
    (event.target as HTMLElement).closest('form')?.requestSubmit();
  }
}
