import type { Params } from '@angular/router';

import { ENERGY_UNITS, type EnergyUnit } from '../../../shared/energy-unit';

/** The Hess form as typed: numbers stay text until they are read for a calculation. */
export interface HessStepValue {
  equation: string;
  deltaH: string;
  uncertainty: string;
}

export interface HessFormValue {
  target: string;
  steps: HessStepValue[];
  unit: EnergyUnit;
  /** Temperature (K) the step values belong to; the result is given at it. */
  temperature: string;
}

export const DEFAULT_TEMPERATURE = '298.15';

/** The inputs of one calculation as one comparable key (text trimmed, as sent). */
export function formKey(value: HessFormValue): string {
  return JSON.stringify([
    value.target.trim(),
    value.steps.map((s) => [s.equation.trim(), s.deltaH.trim(), s.uncertainty.trim()]),
    value.unit,
    value.temperature.trim(),
  ]);
}

// A step travels in the URL as `equation|ΔH|±` (no term of the equation syntax uses `|`).
const SEP = '|';

/** The form as query parameters, so a link (and a return from sign-in) brings it back. */
export function toQueryParams(value: HessFormValue): Params {
  return {
    target: value.target,
    step: value.steps.map((s) => [s.equation, s.deltaH, s.uncertainty].join(SEP)),
    unit: value.unit,
    T: value.temperature,
  };
}

/** The form from query parameters; null when they hold no calculation. */
export function fromQueryParams(params: Params): HessFormValue | null {
  const target = typeof params['target'] === 'string' ? params['target'] : null;
  const raw = params['step'];
  const steps = (Array.isArray(raw) ? raw : typeof raw === 'string' ? [raw] : []).map(
    (text: string) => {
      const [equation = '', deltaH = '', uncertainty = ''] = text.split(SEP);
      return { equation, deltaH, uncertainty };
    },
  );
  if (target === null && steps.length === 0) return null;
  const unit = (ENERGY_UNITS as readonly string[]).includes(params['unit'])
    ? (params['unit'] as EnergyUnit)
    : 'kJ/mol';
  const temperature = typeof params['T'] === 'string' ? params['T'] : DEFAULT_TEMPERATURE;
  return {
    target: target ?? '',
    steps: steps.length > 0 ? steps : [{ equation: '', deltaH: '', uncertainty: '' }],
    unit,
    temperature,
  };
}
