import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

/** A typed number read for calculation, or the reason it is refused. */
export type NumberReading =
  | {
      readonly ok: true;
      readonly value: number;
      /** Digits after the decimal mark, as typed. */ readonly decimals: number;
    }
  | { readonly ok: false; readonly message: string };

// U+2212 minus sign, en dash, figure dash, small and full-width hyphen-minus: all typed or
// pasted as a minus (word processors and spreadsheets turn "-" into these).
const MINUS_LIKE = /[\u2212\u2013\u2012\uFE63\uFF0D]/g;
const PLAIN_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
// Spaces, thin spaces, apostrophes and underscores people use to group thousands.
const GROUPING = /\d[\s\u00A0\u2009\u202F'’_]\d/;

/**
 * Reads a number as people type it, never changing its sign or magnitude silently: U+2212,
 * en dash and hyphen all mean minus; a decimal comma is read when it is the only separator and
 * cannot be a thousands separator (`-283,5`); anything ambiguous (`1,234`, `1.234,5`, `1 234`)
 * is refused with a message saying how to write it.
 */
export function readNumber(typed: string): NumberReading {
  let text = typed.trim().replace(MINUS_LIKE, '-');
  if (text === '') return { ok: false, message: 'Enter a number.' };
  if (GROUPING.test(text)) {
    return {
      ok: false,
      message: 'Write the number without thousands separators, e.g. 1234.5.',
    };
  }
  const commas = text.split(',').length - 1;
  if (commas > 0) {
    if (commas > 1 || text.includes('.')) {
      return {
        ok: false,
        message:
          'Write the number without thousands separators, with a point for decimals, e.g. 1234.5.',
      };
    }
    // One comma followed by exactly three digits reads either as 1.234 or as 1234.
    if (/^[+-]?[1-9]\d{0,2},\d{3}([eE]|$)/.test(text)) {
      const [whole, fraction] = text.split(',');
      return {
        ok: false,
        message: `${text} is ambiguous: write ${whole}.${fraction.slice(0, 3)} or ${whole}${fraction.slice(0, 3)}.`,
      };
    }
    text = text.replace(',', '.');
  }
  if (!PLAIN_NUMBER.test(text)) {
    return { ok: false, message: 'Enter a number such as -283.0 or 1.5e3.' };
  }
  const value = Number(text);
  if (!Number.isFinite(value)) return { ok: false, message: 'The number is too large.' };
  const mantissa = text.replace(/[eE].*$/, '');
  const point = mantissa.indexOf('.');
  const exponent = Number(/[eE]([+-]?\d+)$/.exec(text)?.[1] ?? 0);
  const decimals = Math.max(0, (point === -1 ? 0 : mantissa.length - point - 1) - exponent);
  return { ok: true, value: value === 0 ? 0 : value, decimals };
}

export interface NumberTextOptions {
  required?: boolean;
  /** Smallest allowed value, e.g. 0 for an uncertainty. */
  min?: number;
  /** Words for the message when below `min`. */
  minMessage?: string;
  /** Largest allowed value. */
  max?: number;
  maxMessage?: string;
}

/**
 * Validator for a text control holding a number: the error `number` carries the message to
 * show (`{ number: { message } }`); an empty optional field is valid.
 */
export function numberText(options: NumberTextOptions = {}): ValidatorFn {
  return (control: AbstractControl<string | null>): ValidationErrors | null => {
    const text = control.value ?? '';
    if (text.trim() === '') {
      return options.required ? { number: { message: 'Enter a number.' } } : null;
    }
    const reading = readNumber(text);
    if (!reading.ok) return { number: { message: reading.message } };
    if (options.min !== undefined && reading.value < options.min) {
      return { number: { message: options.minMessage ?? `Must be at least ${options.min}.` } };
    }
    if (options.max !== undefined && reading.value > options.max) {
      return { number: { message: options.maxMessage ?? `Must be at most ${options.max}.` } };
    }
    return null;
  };
}

/** The value of a number text already validated by {@link numberText}; null when empty. */
export function numberValue(text: string | null | undefined): number | null {
  if (!text || text.trim() === '') return null;
  const reading = readNumber(text);
  return reading.ok ? reading.value : null;
}

/** Decimals as typed (`-283.0` → 1), 0 for empty or refused text. */
export function typedDecimals(text: string | null | undefined): number {
  if (!text) return 0;
  const reading = readNumber(text);
  return reading.ok ? reading.decimals : 0;
}
