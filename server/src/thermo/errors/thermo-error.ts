/**
 * The one error type of the thermochemistry engine. Routes map `code` to an HTTP status and show
 * `message` to people; `details` carries machine-readable context (positions, species, ranges).
 */
export const THERMO_ERROR_CODES = [
  'parse_error',
  'unknown_element',
  'unbalanced',
  'no_combination',
  'not_unique',
  'out_of_range',
  'missing_data',
  'invalid_input',
] as const;
export type ThermoErrorCode = (typeof THERMO_ERROR_CODES)[number];

export class ThermoError extends Error {
  readonly code: ThermoErrorCode;
  readonly details: Record<string, unknown>;

  constructor(code: ThermoErrorCode, message: string, details: Record<string, unknown> = {}) {
    super(message);
    this.name = 'ThermoError';
    this.code = code;
    this.details = details;
  }
}

export function isThermoError(value: unknown): value is ThermoError {
  return value instanceof ThermoError;
}

/**
 * A parse error carries `position`, the 0-based index (UTF-16 code units) into the text that was
 * parsed, for programs; its message states the place once for people, counting from 1.
 */
export function parseError(
  message: string,
  position: number,
  extra: Record<string, unknown> = {},
): ThermoError {
  return new ThermoError('parse_error', `${message} at character ${position + 1}`, {
    position,
    ...extra,
  });
}

/** A safe rendering of an arbitrary input for messages (never calls user toString). */
export function shown(value: unknown): string {
  if (typeof value === 'string') return `'${value.length > 40 ? `${value.slice(0, 40)}…` : value}'`;
  if (typeof value === 'number' || typeof value === 'boolean' || typeof value === 'bigint')
    return String(value);
  return value === null ? 'null' : `a value of type ${typeof value}`;
}
