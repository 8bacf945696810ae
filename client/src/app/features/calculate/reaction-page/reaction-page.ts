import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { ActivatedRoute, Router } from '@angular/router';
import { catchError, map, merge, of, startWith, Subject, switchMap } from 'rxjs';

import { LATEST, ReleaseContext } from '../../../core/release-context';
import { ChemText } from '../../../shared/chem-text';
import { DEFAULT_ENERGY_UNIT, type EnergyUnit } from '../../../shared/energy-unit';
import { NumberInput } from '../../../shared/number-input/number-input';
import { numberText, numberValue } from '../../../shared/number-input/number-text';
import { ReleasePicker } from '../../../shared/release-picker/release-picker';
import { SafetyCaution } from '../../../shared/safety-caution/safety-caution';
import { UnitSelect } from '../../../shared/unit-select/unit-select';
import { EquationField } from '../equation-field/equation-field';
import { ReactionApi } from './reaction-api';
import { ReactionCurve } from './reaction-curve/reaction-curve';
import { describeFailure, IDLE, type ReactionOutcome } from './reaction-outcome';
import {
  paramsFromQuery,
  queryFromParams,
  type ReactionQuery,
  sameQuery,
  STANDARD_TEMPERATURE_K,
} from './reaction-query';
import { ReactionResult } from './reaction-result/reaction-result';

/**
 * Calculate → Reaction enthalpy: ΔrH of a balanced equation from a registry release, at any
 * temperature the release's data cover. The calculation lives in the URL (the API's own query
 * parameters), so a link reproduces it; a result shows only while the form still holds exactly
 * the inputs it was computed from.
 */
@Component({
  selector: 'thalpos-reaction-page',
  imports: [
    ReactiveFormsModule,
    MatButton,
    MatIcon,
    MatProgressBar,
    ChemText,
    EquationField,
    NumberInput,
    ReleasePicker,
    SafetyCaution,
    UnitSelect,
    ReactionResult,
    ReactionCurve,
  ],
  templateUrl: './reaction-page.html',
  styleUrl: './reaction-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReactionPage {
  private readonly api = inject(ReactionApi);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly route = inject(ActivatedRoute);
  private readonly router = inject(Router);
  private readonly releases = inject(ReleaseContext);

  protected readonly form = this.fb.group({
    equation: this.fb.control('', Validators.required),
    release: this.fb.control(LATEST),
    temperatureK: this.fb.control(
      String(STANDARD_TEMPERATURE_K),
      numberText({
        required: true,
        min: Number.MIN_VALUE,
        minMessage: 'Enter a temperature above 0 K.',
      }),
    ),
    unit: this.fb.control<EnergyUnit>(DEFAULT_ENERGY_UNIT),
  });

  /** The calculation the URL asks for; the form follows it whenever it changes. */
  private readonly urlQuery$ = this.route.queryParams.pipe(map(queryFromParams));

  /** Calculate pressed again on inputs already in the URL (e.g. after a network failure). */
  private readonly again$ = new Subject<ReactionQuery>();

  protected readonly outcome = toSignal(
    merge(this.urlQuery$, this.again$).pipe(
      switchMap((query) =>
        query === null
          ? of(IDLE)
          : this.api.compute(query).pipe(
              map((answer): ReactionOutcome => ({ kind: 'computed', query, answer })),
              catchError((error: unknown) =>
                of<ReactionOutcome>({ kind: 'failed', query, problem: describeFailure(error) }),
              ),
              startWith<ReactionOutcome>({ kind: 'computing', query }),
            ),
      ),
    ),
    { initialValue: IDLE },
  );

  /** The inputs as the form holds them now; null while any is missing or invalid. */
  private readonly formQuery = toSignal(
    this.form.valueChanges.pipe(
      startWith(null),
      map(() => this.currentQuery()),
    ),
    { initialValue: null },
  );

  /** True when the form no longer holds the inputs the outcome on screen belongs to. */
  protected readonly outOfDate = computed(() => {
    const outcome = this.outcome();
    return outcome.kind !== 'idle' && !sameQuery(outcome.query, this.formQuery());
  });

  protected readonly computing = computed(() => this.outcome().kind === 'computing');

  protected readonly result = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'computed' && !this.outOfDate() ? outcome : null;
  });

  protected readonly problem = computed(() => {
    const outcome = this.outcome();
    return outcome.kind === 'failed' && !this.outOfDate() ? outcome.problem : null;
  });

  protected readonly unit = toSignal(this.form.controls.unit.valueChanges, {
    initialValue: this.form.controls.unit.value,
  });

  constructor() {
    this.urlQuery$.pipe(takeUntilDestroyed()).subscribe((query) => {
      if (query) this.form.setValue({ ...query, temperatureK: String(query.temperatureK) });
      else this.form.controls.release.setValue(this.releases.pinned());
    });
  }

  protected calculate(): void {
    const query = this.currentQuery();
    if (query === null) {
      this.form.markAllAsTouched();
      return;
    }
    // A link should give the same numbers next year: pin the newest release by its version.
    const latest = this.releases.latest();
    const pinned =
      query.release === LATEST && latest !== LATEST ? { ...query, release: latest } : query;
    const current = queryFromParams(this.route.snapshot.queryParams);
    if (sameQuery(current, pinned)) {
      this.again$.next(pinned);
      return;
    }
    void this.router.navigate([], { relativeTo: this.route, queryParams: paramsFromQuery(pinned) });
  }

  protected useEquation(equation: string): void {
    this.form.controls.equation.setValue(equation);
    this.form.controls.equation.markAsDirty();
  }

  protected clear(): void {
    void this.router.navigate([], { relativeTo: this.route, queryParams: {} });
    this.form.reset();
  }

  private currentQuery(): ReactionQuery | null {
    if (this.form.invalid) return null;
    const { equation, release, unit } = this.form.getRawValue();
    const temperatureK = numberValue(this.form.controls.temperatureK.value);
    if (temperatureK === null) return null;
    return { equation: equation.trim(), release, temperatureK, unit };
  }
}
