import { FormArray, FormControl, FormGroup, Validators, type ValidatorFn } from '@angular/forms';

import type { WatchlistRequest, WatchlistView } from '@contracts/watchlists/watchlists-schemas';
import { readNumber } from '../../../shared/number-input/number-text';

export type ReactionGroup = FormGroup<{
  equation: FormControl<string>;
  label: FormControl<string>;
  temperature: FormControl<string>;
}>;

export type WatchlistForm = FormGroup<{
  name: FormControl<string>;
  reactions: FormArray<ReactionGroup>;
}>;

/** Empty, or a temperature in kelvin above zero as people type numbers. */
export const optionalKelvin: ValidatorFn = (control) => {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  const reading = readNumber(text);
  if (!reading.ok) return { kelvin: reading.message };
  return reading.value > 0 && reading.value <= 100_000
    ? null
    : { kelvin: 'Give a temperature above 0 K (at most 100000 K).' };
};

export function reactionGroup(
  value: { equation?: string; label?: string; temperatureK?: number } = {},
): ReactionGroup {
  return new FormGroup({
    equation: new FormControl(value.equation ?? '', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(2000)],
    }),
    label: new FormControl(value.label ?? '', {
      nonNullable: true,
      validators: [Validators.maxLength(200)],
    }),
    temperature: new FormControl(
      value.temperatureK === undefined ? '' : String(value.temperatureK),
      { nonNullable: true, validators: [optionalKelvin] },
    ),
  });
}

export function watchlistForm(from?: WatchlistView): WatchlistForm {
  const reactions = from?.reactions.length ? from.reactions : [{}];
  return new FormGroup({
    name: new FormControl(from?.name ?? '', {
      nonNullable: true,
      validators: [Validators.required, Validators.maxLength(100)],
    }),
    reactions: new FormArray(reactions.map((r) => reactionGroup(r))),
  });
}

/** The request body: trimmed text, optional fields left out when blank. */
export function watchlistRequest(form: WatchlistForm): WatchlistRequest {
  const { name, reactions } = form.getRawValue();
  return {
    name: name.trim(),
    reactions: reactions.map((r) => {
      const label = r.label.trim();
      const reading = r.temperature.trim() ? readNumber(r.temperature) : null;
      return {
        equation: r.equation.trim(),
        ...(label ? { label } : {}),
        ...(reading?.ok ? { temperatureK: reading.value } : {}),
      };
    }),
  };
}
