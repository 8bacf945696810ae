import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import {
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatError, MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import {
  MatCell,
  MatCellDef,
  MatColumnDef,
  MatFooterCell,
  MatFooterCellDef,
  MatFooterRow,
  MatFooterRowDef,
  MatHeaderCell,
  MatHeaderCellDef,
  MatHeaderRow,
  MatHeaderRowDef,
  MatRow,
  MatRowDef,
  MatTable,
} from '@angular/material/table';
import { catchError, map, of, startWith, Subject, switchMap } from 'rxjs';

import { DEFAULT_ENERGY_UNIT, type EnergyUnit } from '../../../shared/energy-unit';
import { SafetyCaution } from '../../../shared/safety-caution/safety-caution';
import { UnitSelect } from '../../../shared/unit-select/unit-select';
import { CalculateApi } from '../calculate-api';
import { EquationField } from '../equation-field/equation-field';
import type { HessRequest, HessStepInput } from '../models/hess';
import { REFORMING_CHECK, REFORMING_CHECK_NOTE } from './hess-example';
import { failed, IDLE, solved, SOLVING } from './hess-outcome';

type StepForm = FormGroup<{
  equation: FormControl<string>;
  deltaH: FormControl<number | null>;
  uncertainty: FormControl<number | null>;
}>;

/** The server takes at most this many steps. */
export const MAX_STEPS = 50;

interface StepValue {
  equation: string;
  deltaH: number | null;
  uncertainty: number | null;
}

/** Calculate → Hess combination: find how given steps add up to a target, and sum their ΔH. */
@Component({
  selector: 'thalpos-hess-page',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatIconButton,
    MatFormField,
    MatLabel,
    MatHint,
    MatError,
    MatInput,
    MatIcon,
    MatProgressBar,
    MatTable,
    MatColumnDef,
    MatHeaderCell,
    MatHeaderCellDef,
    MatCell,
    MatCellDef,
    MatFooterCell,
    MatFooterCellDef,
    MatHeaderRow,
    MatHeaderRowDef,
    MatRow,
    MatRowDef,
    MatFooterRow,
    MatFooterRowDef,
    EquationField,
    SafetyCaution,
    UnitSelect,
  ],
  templateUrl: './hess-page.html',
  styleUrl: './hess-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HessPage {
  private readonly api = inject(CalculateApi);
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly exampleNote = REFORMING_CHECK_NOTE;
  protected readonly maxSteps = MAX_STEPS;
  protected readonly columns = ['step', 'equation', 'flipped', 'scale', 'deltaH'] as const;

  protected readonly form = this.fb.group({
    target: this.fb.control(REFORMING_CHECK.target, Validators.required),
    steps: this.fb.array<StepForm>(REFORMING_CHECK.steps.map((step) => this.stepForm(step))),
    unit: this.fb.control<EnergyUnit>(REFORMING_CHECK.unit),
  });

  protected readonly unit = toSignal(this.form.controls.unit.valueChanges, {
    initialValue: this.form.controls.unit.value,
  });

  /** Set when Calculate is pressed with fields missing. */
  protected readonly incomplete = signal(false);

  private readonly requests = new Subject<HessRequest>();

  protected readonly outcome = toSignal(
    this.requests.pipe(
      switchMap((request) =>
        this.api.solveHess(request).pipe(
          map((solution) => solved(request, solution)),
          catchError((error: unknown) => of(failed(error))),
          startWith(SOLVING),
        ),
      ),
    ),
    { initialValue: IDLE },
  );

  protected readonly solving = computed(() => this.outcome().kind === 'solving');
  protected readonly solution = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'solved' ? outcome : null;
  });
  protected readonly failure = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'failed' ? outcome : null;
  });

  protected get steps() {
    return this.form.controls.steps;
  }

  protected addStep(): void {
    if (this.steps.length < MAX_STEPS) this.steps.push(this.stepForm());
  }

  protected removeStep(index: number): void {
    if (this.steps.length > 1) this.steps.removeAt(index);
  }

  protected loadExample(): void {
    this.fill(REFORMING_CHECK.target, REFORMING_CHECK.steps, REFORMING_CHECK.unit);
  }

  protected clear(): void {
    this.fill('', [{}], DEFAULT_ENERGY_UNIT);
  }

  protected calculate(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      this.incomplete.set(true);
      return;
    }
    this.incomplete.set(false);
    const { target, steps, unit } = this.form.getRawValue();
    this.requests.next({ target: target.trim(), steps: steps.map(toStepInput), unit });
  }

  private fill(target: string, steps: readonly Partial<StepValue>[], unit: EnergyUnit): void {
    this.form.controls.target.setValue(target);
    this.steps.clear();
    for (const step of steps) this.steps.push(this.stepForm(step));
    this.form.controls.unit.setValue(unit);
    this.form.markAsPristine();
    this.form.markAsUntouched();
    this.incomplete.set(false);
  }

  private stepForm(step: Partial<StepValue> = {}): StepForm {
    return this.fb.group({
      equation: this.fb.control(step.equation ?? '', Validators.required),
      deltaH: this.fb.control<number | null>(step.deltaH ?? null, Validators.required),
      uncertainty: this.fb.control<number | null>(step.uncertainty ?? null, Validators.min(0)),
    });
  }
}

function toStepInput(step: StepValue): HessStepInput {
  const input: HessStepInput = { equation: step.equation.trim(), deltaH: step.deltaH ?? 0 };
  if (step.uncertainty !== null) input.uncertainty = step.uncertainty;
  return input;
}
