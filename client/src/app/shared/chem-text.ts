import { Pipe, PipeTransform } from '@angular/core';

const SUBSCRIPT: Record<string, string> = {
  '0': '₀',
  '1': '₁',
  '2': '₂',
  '3': '₃',
  '4': '₄',
  '5': '₅',
  '6': '₆',
  '7': '₇',
  '8': '₈',
  '9': '₉',
};
const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
  '+': '⁺',
  '-': '⁻',
};

const isDigit = (c: string | undefined): boolean => c !== undefined && c >= '0' && c <= '9';
const isUpper = (c: string | undefined): boolean => c !== undefined && c >= 'A' && c <= 'Z';
const isLower = (c: string | undefined): boolean => c !== undefined && c >= 'a' && c <= 'z';
/** Characters after which a count is a subscript: an element symbol or a closing group. */
const endsFormulaPart = (c: string | undefined): boolean =>
  isUpper(c) || isLower(c) || c === ')' || c === ']';

const superscript = (digits: string, sign: string): string =>
  [...digits].map((d) => SUPERSCRIPT[d]).join('') + SUPERSCRIPT[sign];

/**
 * Plain formula or equation text (as typed, or as the API prints it) in display form: counts
 * as subscripts (H₂O, Fe₀.₉₄₇O), charges as superscripts (SO₄²⁻, Fe³⁺, Na⁺), the hydrate dot as
 * `·` and `->` as one arrow glyph `→` (which cannot break across lines). Coefficients, hydrate
 * multipliers, phases (`(g)`, `(cr,graphite)`) and registry keys (`[2-methylpropane]`) stay
 * as written. Inputs keep the plain text; only display goes through here.
 */
export function chemText(text: string | null | undefined): string {
  if (!text) return '';
  let out = '';
  let i = 0;
  while (i < text.length) {
    const c = text[i];
    const prev = text[i - 1];
    // A registry key or a phase: copied as written up to its closing bracket.
    if ((c === '[' || c === '(') && (isLower(text[i + 1]) || (c === '[' && isDigit(text[i + 1])))) {
      const close = text.indexOf(c === '[' ? ']' : ')', i);
      const end = close === -1 ? text.length : close + 1;
      out += text.slice(i, end);
      i = end;
      continue;
    }
    if (c === '-' && text[i + 1] === '>') {
      out += '→';
      i += 2;
      continue;
    }
    // `^2-`, `^3+`, `^+`, and the sign-first `^-3`.
    if (c === '^') {
      const m = /^\^(?:([+-])(\d+)|(\d*)([+-]))/.exec(text.slice(i));
      if (m) {
        out += m[1] ? superscript(m[2], m[1]) : superscript(m[3], m[4]);
        i += m[0].length;
        continue;
      }
    }
    // A bare trailing sign is a charge only when a delimiter follows, as the parser reads it,
    // so `H2+O2` keeps its separator and `H2O->` its arrow.
    if ((c === '+' || c === '-') && (endsFormulaPart(prev) || isDigit(prev))) {
      const next = text[i + 1];
      if (next === undefined || /[\s(=→,;]/.test(next)) {
        out += SUPERSCRIPT[c];
        i += 1;
        continue;
      }
    }
    if ((c === '*' || c === '·') && (endsFormulaPart(prev) || isDigit(prev))) {
      out += '·';
      i += 1;
      continue;
    }
    // Counts: digits (and a decimal point between digits) right after an element or a group.
    if (isDigit(c) && endsFormulaPart(prev)) {
      while (i < text.length && (isDigit(text[i]) || (text[i] === '.' && isDigit(text[i + 1])))) {
        out += SUBSCRIPT[text[i]] ?? text[i];
        i += 1;
      }
      continue;
    }
    // Coefficients and hydrate multipliers (`2 H2O`, `1/2 O2`, `·5H2O`): copied as a whole run so
    // the count rule above never sees their last digit as following a formula part.
    if (isDigit(c)) {
      while (i < text.length && (isDigit(text[i]) || text[i] === '.' || text[i] === '/')) {
        out += text[i];
        i += 1;
      }
      continue;
    }
    out += c;
    i += 1;
  }
  return out;
}

/** `{{ 'SO4^2-(aq)' | chemText }}` → `SO₄²⁻(aq)`. */
@Pipe({ name: 'chemText' })
export class ChemText implements PipeTransform {
  transform(text: string | null | undefined): string {
    return chemText(text);
  }
}
