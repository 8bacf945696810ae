import type { Params } from '@angular/router';

import { ENERGY_UNITS, type EnergyUnit } from '../../../shared/energy-unit';

/** The temperature the API uses when none is given, and the one the form starts with. */
export const STANDARD_TEMPERATURE_K = 298.15;

/**
 * One reaction-enthalpy calculation exactly as the URL, the API's GET query and the form hold it.
 * The query parameter names are the API's own, so a link and "copy as curl" say the same thing.
 */
export interface ReactionQuery {
  readonly equation: string;
  /** A release version such as `2026.1`, or `latest`. */
  readonly release: string;
  readonly temperatureK: number;
  readonly unit: EnergyUnit;
}

/** The calculation a URL asks for, or null when it names no equation. Bad values fall back. */
export function queryFromParams(params: Params): ReactionQuery | null {
  const equation = text(params['equation']).trim();
  if (equation === '') return null;
  const temperature = Number(text(params['temperatureK']));
  const unit = text(params['unit']);
  return {
    equation,
    release: text(params['release']).trim() || 'latest',
    temperatureK:
      Number.isFinite(temperature) && temperature > 0 ? temperature : STANDARD_TEMPERATURE_K,
    unit: isEnergyUnit(unit) ? unit : 'kJ/mol',
  };
}

/** URL query parameters for a calculation (every field written, so the link pins all of it). */
export function paramsFromQuery(query: ReactionQuery): Params {
  return {
    equation: query.equation,
    release: query.release,
    temperatureK: String(query.temperatureK),
    unit: query.unit,
  };
}

export function sameQuery(a: ReactionQuery | null, b: ReactionQuery | null): boolean {
  if (a === null || b === null) return a === b;
  return (
    a.equation === b.equation &&
    a.release === b.release &&
    a.temperatureK === b.temperatureK &&
    a.unit === b.unit
  );
}

/** The API's GET address for a calculation, absolute against `origin`. */
export function apiUrl(origin: string, query: ReactionQuery): string {
  const search = new URLSearchParams(paramsFromQuery(query) as Record<string, string>);
  return `${origin}/api/v1/reaction-enthalpy?${search.toString()}`;
}

/** A shell command that asks the API the same question (POSIX single quotes escaped). */
export function curlCommand(origin: string, query: ReactionQuery): string {
  const quoted = `'${apiUrl(origin, query).replaceAll("'", `'\\''`)}'`;
  return `curl -sS -H 'Accept: application/json' ${quoted}`;
}

function text(value: unknown): string {
  if (Array.isArray(value)) return text(value[0]);
  return typeof value === 'string' ? value : '';
}

function isEnergyUnit(value: string): value is EnergyUnit {
  return (ENERGY_UNITS as readonly string[]).includes(value);
}
