import { DOCUMENT } from '@angular/common';
import {
  ChangeDetectionStrategy,
  Component,
  computed,
  DestroyRef,
  inject,
  signal,
} from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import {
  FormControl,
  FormGroup,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { ActivatedRoute, Router } from '@angular/router';
import type { HessInput, HessAnswer } from '@contracts/calculate/calculate-schemas';
import { debounceTime, filter, firstValueFrom, map, startWith, Subscription } from 'rxjs';

import { ApiError } from '../../../core/api-error';
import { DEFAULT_ENERGY_UNIT, type EnergyUnit } from '../../../shared/energy-unit';
import { NumberInput } from '../../../shared/number-input/number-input';
import { numberText, numberValue } from '../../../shared/number-input/number-text';
import { SafetyCaution } from '../../../shared/safety-caution/safety-caution';
import { UnitSelect } from '../../../shared/unit-select/unit-select';
import { CalculateApi } from '../calculate-api';
import { termsWithoutPhase } from '../equation-check';
import { EquationChecker } from '../equation-checker';
import { EquationField } from '../equation-field/equation-field';
import { HessResult } from '../hess-result/hess-result';
import { FUEL_GAS_CHECK, FUEL_GAS_CHECK_NOTE } from './hess-example';
import {
  DEFAULT_TEMPERATURE,
  formKey,
  fromQueryParams,
  type HessFormValue,
  type HessStepValue,
  toQueryParams,
} from './hess-form';
import { failure, type HessOutcome, IDLE, solvedView } from './hess-outcome';

type StepForm = FormGroup<{
  equation: FormControl<string>;
  deltaH: FormControl<string>;
  uncertainty: FormControl<string>;
}>;

/** The server takes at most this many steps. */
export const MAX_STEPS = 50;

const EMPTY_STEP: HessStepValue = { equation: '', deltaH: '', uncertainty: '' };

/** Calculate → Hess combination: find how given steps add up to a target, and sum their ΔH. */
@Component({
  selector: 'thalpos-hess-page',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatIconButton,
    MatIcon,
    MatProgressBar,
    EquationField,
    NumberInput,
    SafetyCaution,
    UnitSelect,
    HessResult,
  ],
  templateUrl: './hess-page.html',
  styleUrl: './hess-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HessPage {
  private readonly api = inject(CalculateApi);
  private readonly checker = inject(EquationChecker);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly router = inject(Router);
  private readonly route = inject(ActivatedRoute);
  private readonly document = inject(DOCUMENT);

  protected readonly exampleNote = FUEL_GAS_CHECK_NOTE;
  protected readonly maxSteps = MAX_STEPS;
  protected readonly limitNotice = this.checker.limitNotice;

  protected readonly form = this.fb.group({
    target: this.fb.control('', Validators.required),
    steps: this.fb.array<StepForm>([]),
    unit: this.fb.control<EnergyUnit>(DEFAULT_ENERGY_UNIT),
    temperature: this.fb.control(
      DEFAULT_TEMPERATURE,
      numberText({ required: true, min: 0, minMessage: 'Must be above 0 K.' }),
    ),
  });

  private readonly value = toSignal(
    this.form.valueChanges.pipe(
      startWith(null),
      map(() => this.form.getRawValue()),
    ),
    { initialValue: this.form.getRawValue() },
  );
  protected readonly unit = computed(() => this.value().unit);
  /** Shown while the example is on screen, and only then. */
  protected readonly showingExample = computed(
    () => formKey(this.value()) === formKey(FUEL_GAS_CHECK),
  );

  /** Why Calculate was refused, in the form's words (1-based steps). */
  protected readonly problems = signal<readonly string[]>([]);
  protected readonly outcome = signal<HessOutcome>(IDLE);
  private solving: Subscription | null = null;
  /** Key of the inputs last written to the URL. */
  private written = '';

  /** A result or failure belongs to exactly the inputs it was computed from. */
  protected readonly stale = computed(() => {
    const outcome = this.outcome();
    return outcome.kind !== 'idle' && outcome.key !== formKey(this.value());
  });
  protected readonly solution = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'solved' ? outcome : null;
  });
  protected readonly failed = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'failed' && !this.stale() ? outcome : null;
  });
  protected readonly busy = computed(() => this.outcome().kind === 'solving' && !this.stale());
  /** The link of the result on screen: the inputs it was computed from. */
  protected readonly link = signal('');

  constructor() {
    const fromUrl = fromQueryParams(this.route.snapshot.queryParams);
    this.fill(fromUrl ?? FUEL_GAS_CHECK);
    // The calculation lives in the URL (replacing, not stacking, history entries), so a link,
    // a reload or a return from sign-in brings the inputs back.
    this.form.valueChanges
      .pipe(debounceTime(300), takeUntilDestroyed())
      .subscribe(() => this.writeUrl());
    // A link followed within the screen (e.g. "Link to this calculation") refills the form.
    this.route.queryParams
      .pipe(
        map((params) => fromQueryParams(params)),
        filter((value): value is HessFormValue => value !== null),
        // Skip the echo of our own URL writes, which may lag behind newer typing.
        filter(
          (value) => ![this.written, formKey(this.form.getRawValue())].includes(formKey(value)),
        ),
        takeUntilDestroyed(),
      )
      .subscribe((value) => this.fill(value));
    inject(DestroyRef).onDestroy(() => this.solving?.unsubscribe());
    if (fromUrl && this.form.valid) void this.calculate();
  }

  protected get steps() {
    return this.form.controls.steps;
  }

  protected addStep(): void {
    if (this.steps.length < MAX_STEPS) this.steps.push(this.stepForm(EMPTY_STEP));
  }

  protected removeStep(index: number): void {
    if (this.steps.length > 1) this.steps.removeAt(index);
  }

  protected loadExample(): void {
    this.fill(FUEL_GAS_CHECK);
  }

  protected clear(): void {
    this.fill({
      target: '',
      steps: [EMPTY_STEP],
      unit: DEFAULT_ENERGY_UNIT,
      temperature: DEFAULT_TEMPERATURE,
    });
    this.cancel();
  }

  protected async calculate(): Promise<void> {
    const value = this.form.getRawValue();
    const problems = this.formProblems();
    if (problems.length === 0) problems.push(...(await this.equationProblems(value)));
    this.problems.set(problems);
    if (problems.length > 0) {
      this.form.markAllAsTouched();
      this.cancel();
      return;
    }
    if (this.checker.limitNotice()) return;
    const key = formKey(value);
    const request = toRequest(value);
    this.solving?.unsubscribe();
    this.outcome.set({ kind: 'solving', key });
    this.solving = this.api.solveHess(request).subscribe({
      next: (answer: HessAnswer) => {
        this.link.set(this.linkTo(value));
        this.outcome.set({ kind: 'solved', key, view: solvedView(value, answer) });
      },
      error: (error: unknown) => {
        if (error instanceof ApiError && error.rateLimited) {
          // One calm notice for the screen (with the wait), not a failure box as well.
          this.checker.pauseFor(error.retryAfter);
          this.outcome.set(IDLE);
          return;
        }
        this.outcome.set({ kind: 'failed', key, ...failure(error) });
      },
    });
  }

  private cancel(): void {
    this.solving?.unsubscribe();
    this.outcome.set(IDLE);
  }

  /** Missing or unreadable fields, named as the form names them. */
  private formProblems(): string[] {
    const problems: string[] = [];
    const { target, temperature } = this.form.controls;
    if (target.invalid) problems.push('Target equation: enter an equation.');
    this.steps.controls.forEach((step, i) => {
      const { equation, deltaH, uncertainty } = step.controls;
      if (equation.invalid) problems.push(`Step ${i + 1} equation: enter an equation.`);
      if (deltaH.invalid) problems.push(`Step ${i + 1} ΔH: ${numberMessage(deltaH)}`);
      if (uncertainty.invalid) problems.push(`Step ${i + 1} ±: ${numberMessage(uncertainty)}`);
    });
    if (temperature.invalid) problems.push(`Temperature: ${numberMessage(temperature)}`);
    return problems;
  }

  /** What the live check found wrong: unreadable equations and terms without a phase. */
  private async equationProblems(value: HessFormValue): Promise<string[]> {
    const named = [
      { name: 'Target equation', text: value.target.trim() },
      ...value.steps.map((s, i) => ({ name: `Step ${i + 1} equation`, text: s.equation.trim() })),
    ];
    // All at once: answers already known come from the checker without a request.
    const checks = await Promise.all(
      named.map(({ text }) =>
        firstValueFrom(
          this.checker
            .check(text)
            .pipe(filter((c) => c.state !== 'checking' && c.state !== 'paused')),
        ),
      ),
    );
    const problems: string[] = [];
    checks.forEach((check, i) => {
      const { name } = named[i];
      if (check.state === 'invalid') {
        const where = check.position === null ? '' : ` at character ${check.position + 1}`;
        problems.push(`${name}: cannot be read${where}: ${check.message}.`);
      } else if ('parsed' in check) {
        const missing = termsWithoutPhase(check.parsed);
        if (missing.length > 0) {
          problems.push(`${name}: ${missing.join(', ')} needs a phase, e.g. ${missing[0]}(g).`);
        }
      }
    });
    return problems;
  }

  private fill(value: HessFormValue): void {
    this.form.controls.target.setValue(value.target, { emitEvent: false });
    this.steps.clear({ emitEvent: false });
    for (const step of value.steps.slice(0, MAX_STEPS)) {
      this.steps.push(this.stepForm(step), { emitEvent: false });
    }
    this.form.controls.unit.setValue(value.unit, { emitEvent: false });
    this.form.controls.temperature.setValue(value.temperature, { emitEvent: false });
    this.form.updateValueAndValidity();
    this.form.markAsPristine();
    this.form.markAsUntouched();
    this.problems.set([]);
  }

  private stepForm(step: HessStepValue): StepForm {
    return this.fb.group({
      equation: this.fb.control(step.equation, Validators.required),
      deltaH: this.fb.control(step.deltaH, numberText({ required: true })),
      uncertainty: this.fb.control(
        step.uncertainty,
        numberText({ min: 0, minMessage: 'Must not be negative.' }),
      ),
    });
  }

  private writeUrl(): void {
    const value = this.form.getRawValue();
    this.written = formKey(value);
    void this.router.navigate([], {
      relativeTo: this.route,
      queryParams: toQueryParams(value),
      replaceUrl: true,
    });
  }

  private linkTo(value: HessFormValue): string {
    const tree = this.router.createUrlTree([], {
      relativeTo: this.route,
      queryParams: toQueryParams(value),
    });
    return this.document.location.origin + this.router.serializeUrl(tree);
  }
}

function numberMessage(control: FormControl<string>): string {
  const error = control.errors?.['number'] as { message?: string } | undefined;
  return error?.message ?? 'enter a number.';
}

/** The request exactly as the form reads: numbers through the one shared parser. */
function toRequest(value: HessFormValue): HessInput {
  return {
    target: value.target.trim(),
    unit: value.unit,
    steps: value.steps.map((s) => {
      const uncertainty = numberValue(s.uncertainty);
      return {
        equation: s.equation.trim(),
        deltaH: numberValue(s.deltaH) ?? 0,
        ...(uncertainty === null ? {} : { uncertainty }),
      };
    }),
  };
}
