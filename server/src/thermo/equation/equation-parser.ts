import type Fraction from 'fraction.js';
import { parseError, ThermoError } from '../errors/thermo-error';
import {
  netEquation,
  makeTemplate,
  makeTerm,
  PHASE_WORDS,
  standsAlone,
  type TermTemplate,
} from './equation-builder';
import {
  PHASES,
  type Equation,
  type FormulaSpecies,
  type KeySpecies,
  type Phase,
  type Term,
} from './equation-types';
import {
  ARROW,
  parseCached,
  coefficientCache,
  digitCode,
  EQUALS,
  GREATER,
  MINUS,
  PLUS,
  remember,
  spaceCode,
  templateCache,
  tokenExtent,
  ZERO_CODE,
} from './cached-equation-parser';
import { scanTermFormula } from '../formula/formula-parser';
import { frac, ONE } from '../rational/rational';

/*
 * Equation syntax: `CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)`.
 *   arrow        `->`, `=` or `→`, exactly one
 *   coefficient  integer, decimal (`0.5`) or fraction (`1/2`), optional, space optional, no
 *                leading zeros (`01` is refused, as the count `H01` is)
 *   species      formula (`SO4^2-`, `CuSO4·5H2O`, `CaSO4·1/2H2O`, `Fe0.947O`) or registry key in
 *                brackets (`[2-methylpropane]`)
 *   phase        optional `(g|l|cr|s|am|aq)`, in lower case; a crystal modification's name alone
 *                stands for the crystal (`C(diamond)`); `(cr,diamond)` is read as the same
 * A bracket group that reads as a formula is a formula (`[Fe(CN)6]^4-`); only a bracket that is
 * not a formula is a registry key.
 */

const MAX_LENGTH = 20000;
const MAX_COEFFICIENT_LENGTH = 32;
const MAX_LABEL = 64;

/** Element groups that look like a phase written in capitals at the end of a term. */
const CAPITAL_PHASE_GROUP = /\((S|Cr|Am)\)$/;

const isDigit = (c: string): boolean => c >= '0' && c <= '9';
const isLower = (c: string): boolean => c >= 'a' && c <= 'z';
const isSpace = (c: string): boolean => c === ' ' || c === '\t' || c === '\n' || c === '\r';

class EquationParser {
  pos = 0;

  constructor(private readonly text: string) {}

  equation(): Equation {
    const reactants = this.side('reactant');
    this.skipSpace();
    const arrow = this.arrowLength();
    if (arrow === 0) {
      if (this.pos >= this.text.length) {
        throw parseError(
          "expected an arrow ('->', '=' or '→') between reactants and products",
          this.pos,
        );
      }
      throw parseError(
        `expected '+' or an arrow ('->', '=' or '→') but found '${this.text[this.pos]}'`,
        this.pos,
        {
          found: this.text[this.pos],
        },
      );
    }
    this.pos += arrow;
    const products = this.side('product');
    this.skipSpace();
    if (this.pos < this.text.length) {
      if (this.arrowLength() > 0)
        throw parseError('an equation has exactly one arrow; found another', this.pos);
      throw parseError(
        `expected '+' or the end of the equation but found '${this.text[this.pos]}'`,
        this.pos,
        {
          found: this.text[this.pos],
        },
      );
    }
    return netEquation(reactants, products);
  }

  side(which: 'reactant' | 'product'): Term[] {
    const terms: Term[] = [];
    for (;;) {
      this.skipSpace();
      if (this.pos >= this.text.length || this.arrowLength() > 0) {
        const where = which === 'reactant' ? 'before the arrow' : 'after the arrow';
        throw parseError(
          terms.length === 0 ? `expected a species ${where}` : "expected a species after '+'",
          this.pos,
        );
      }
      terms.push(this.term());
      this.skipSpace();
      if (this.text.charCodeAt(this.pos) === PLUS) {
        this.pos++;
        continue;
      }
      return terms;
    }
  }

  term(): Term {
    const coefficient = this.coefficient();
    const start = this.pos;
    const extent = tokenExtent(this.text, start);
    const token = this.text.slice(start, extent);
    const hit = templateCache.get(token);
    if (hit !== undefined) {
      this.pos = extent;
      return makeTerm(coefficient, hit);
    }
    const template = this.speciesAndPhase();
    if (this.pos === extent) remember(templateCache, token, template);
    return makeTerm(coefficient, template);
  }

  coefficient(): Fraction {
    if (!digitCode(this.text.charCodeAt(this.pos))) return ONE;
    const start = this.pos;
    while (digitCode(this.text.charCodeAt(this.pos))) this.pos++;
    if (this.pos - start > 1 && this.text.charCodeAt(start) === ZERO_CODE)
      throw parseError('a coefficient is written without leading zeros', start);
    const sep = this.text[this.pos];
    if (sep === '.' || sep === '/') {
      this.pos++;
      const afterSep = this.pos;
      while (isDigit(this.text[this.pos] ?? '')) this.pos++;
      if (this.pos === afterSep) {
        throw parseError(
          sep === '.'
            ? 'expected digits after the decimal point'
            : "expected a denominator after '/'",
          this.pos,
        );
      }
    }
    let value: Fraction | undefined;
    const literal = this.text.slice(start, this.pos);
    if (this.pos === start + 1) {
      // A single digit, the usual case: no cache round trip.
      value = frac(this.text.charCodeAt(start) - ZERO_CODE);
      if (value.n === 0n) throw parseError('a coefficient must be greater than zero', start);
    } else {
      if (literal.length > MAX_COEFFICIENT_LENGTH)
        throw parseError('coefficient has too many digits', start);
      value = coefficientCache.get(literal);
      if (value === undefined) {
        value = literalToFraction(literal, start);
        remember(coefficientCache, literal, value);
      }
    }
    this.skipSpace();
    if (
      this.pos >= this.text.length ||
      this.arrowLength() > 0 ||
      this.text.charCodeAt(this.pos) === PLUS
    ) {
      throw parseError(`expected a species after the coefficient ${literal}`, this.pos);
    }
    return value;
  }

  speciesAndPhase(): TermTemplate {
    const start = this.pos;
    const species = this.text[start] === '[' ? this.bracketSpecies() : this.formulaSpecies();
    let phase: Phase | null = null;
    let modification: string | null = null;
    if (this.text[this.pos] === '(' && isLower(this.text[this.pos + 1] ?? '')) {
      [phase, modification] = this.phaseLabel();
    }
    return makeTemplate(species, phase, modification);
  }

  formulaSpecies(): FormulaSpecies {
    const c = this.text[this.pos] as string;
    if (c === '.' || c === '/') throw parseError(`unexpected '${c}' in a coefficient`, this.pos);
    let scanned: ReturnType<typeof scanTermFormula>;
    try {
      scanned = scanTermFormula(this.text, this.pos);
    } catch (err) {
      throw capitalPhase(this.text, err) ?? err;
    }
    const { formula, end } = scanned;
    // Judged on the canonical form, so that printed equations always read back.
    const group = CAPITAL_PHASE_GROUP.exec(formula.formula);
    if (group !== null) {
      const written = group[1] as string;
      throw parseError(
        `'(${written})' reads as an element group, not a phase: phases are written in lower case, (${written.toLowerCase()}); write ${written} without brackets to mean the element`,
        Math.max(this.pos, this.text.lastIndexOf('(', end - 1)),
        { phase: written },
      );
    }
    this.pos = end;
    return Object.freeze({ kind: 'formula', ...formula });
  }

  /** `[...]` is a formula group when it reads as one, else a registry key. */
  bracketSpecies(): FormulaSpecies | KeySpecies {
    const start = this.pos;
    let formulaError: unknown;
    try {
      // A formula that stops before a term boundary is left to the caller's error message.
      return this.formulaSpecies();
    } catch (err) {
      formulaError = err;
    }
    this.pos = start;
    const close = this.text.indexOf(']', start + 1);
    const key = close < 0 ? '' : this.text.slice(start + 1, close);
    if (close > 0 && isRegistryKey(key)) {
      this.pos = close + 1;
      return Object.freeze({ kind: 'key', key });
    }
    throw formulaError;
  }

  phaseLabel(): [Phase, string | null] {
    const open = this.pos;
    this.pos++;
    const wordStart = this.pos;
    while (isLower(this.text[this.pos] ?? '')) this.pos++;
    const word = this.text.slice(wordStart, this.pos);
    if (!(PHASES as readonly string[]).includes(word)) return this.modificationAlone(wordStart);
    let modification: string | null = null;
    if (this.text[this.pos] === ',') {
      this.pos++;
      const labelStart = this.pos;
      while (this.pos < this.text.length && !'()[],'.includes(this.text[this.pos] as string))
        this.pos++;
      const label = this.text.slice(labelStart, this.pos).trim().replace(/\s+/g, ' ');
      if (label === '')
        throw parseError(
          'expected a modification label after the comma, e.g. (cr,graphite)',
          labelStart,
        );
      if (label.length > MAX_LABEL) throw parseError('modification label too long', labelStart);
      modification = label;
    }
    if (this.text[this.pos] !== ')') {
      throw parseError("expected ')' to close the phase label", this.pos, { opened: open });
    }
    this.pos++;
    return [word as Phase, modification];
  }

  /** `(diamond)`: a modification's name alone stands for its crystal phase. */
  modificationAlone(start: number): [Phase, string] {
    let end = start;
    while (end < this.text.length && !'()[],'.includes(this.text[end] as string)) end++;
    const label = this.text.slice(start, end).trim().replace(/\s+/g, ' ');
    const word = /^[a-z]*/.exec(this.text.slice(start))![0];
    const meant = Object.prototype.hasOwnProperty.call(PHASE_WORDS, word)
      ? PHASE_WORDS[word]
      : undefined;
    if (meant !== undefined || this.text[end] !== ')' || !standsAlone(label)) {
      const hint = meant === undefined ? '' : ` — did you mean (${meant})?`;
      throw parseError(
        `unknown phase '${word}'; use g, l, cr, s, am or aq, or a crystal modification's name such as (diamond)${hint}`,
        start,
        { phase: word },
      );
    }
    if (label.length > MAX_LABEL) throw parseError('modification label too long', start);
    this.pos = end + 1;
    return ['cr', label];
  }

  arrowLength(): number {
    const c = this.text.charCodeAt(this.pos);
    if (c === EQUALS || c === ARROW) return 1;
    if (c === MINUS && this.text.charCodeAt(this.pos + 1) === GREATER) return 2;
    return 0;
  }

  skipSpace(): void {
    while (spaceCode(this.text.charCodeAt(this.pos))) this.pos++;
  }
}

/** `(G)`, `(AQ)`, `(CR)`: a phase in capitals fails as an unknown element; say what it is. */
function capitalPhase(text: string, err: unknown): ThermoError | null {
  if (!(err instanceof ThermoError) || err.code !== 'unknown_element') return null;
  const at = err.details['position'];
  if (typeof at !== 'number') return null;
  const open = text.lastIndexOf('(', at);
  if (open < 0 || !/^[A-Za-z]*$/.test(text.slice(open + 1, at))) return null;
  const close = text.indexOf(')', at);
  const inner = close < 0 ? '' : text.slice(open + 1, close);
  const lower = inner.toLowerCase();
  const phase = lower.split(',')[0] as string;
  if (!Object.prototype.hasOwnProperty.call(PHASE_WORDS, phase)) return null;
  return parseError(`phases are written in lower case: write (${lower}), not (${inner})`, open, {
    phase: inner,
  });
}

function literalToFraction(literal: string, position: number): Fraction {
  let value: Fraction;
  const slash = literal.indexOf('/');
  if (slash >= 0) {
    const d = BigInt(literal.slice(slash + 1));
    if (d === 0n)
      throw parseError('a fraction cannot have a zero denominator', position + slash + 1);
    value = frac(BigInt(literal.slice(0, slash)), d);
  } else {
    const dot = literal.indexOf('.');
    const digits = dot < 0 ? literal : literal.slice(0, dot) + literal.slice(dot + 1);
    const places = dot < 0 ? 0 : literal.length - dot - 1;
    value =
      places === 0 && digits.length <= 2
        ? frac(Number(digits))
        : frac(BigInt(digits), 10n ** BigInt(places));
  }
  if (value.n === 0n) throw parseError('a coefficient must be greater than zero', position);
  return value;
}

/** Registry keys: printable, no whitespace or brackets, and not readable as a formula. */
export function isRegistryKey(key: string): boolean {
  if (typeof key !== 'string' || key.length === 0 || key.length > 200) return false;
  for (const c of key) {
    if (isSpace(c) || c === '[' || c === ']' || c < ' ') return false;
  }
  try {
    return scanTermFormula(`[${key}]`, 0).end !== key.length + 2;
  } catch {
    return true;
  }
}

function checkInput(text: unknown): string {
  if (typeof text !== 'string')
    throw new ThermoError('invalid_input', 'an equation must be a string');
  if (text.length > MAX_LENGTH)
    throw new ThermoError('invalid_input', `equation longer than ${MAX_LENGTH} characters`);
  return text;
}

/** The full parser alone, without the cached path (the reference the cached path must match). */
export function parseEquationUncached(text: string): Equation {
  return new EquationParser(checkInput(text)).equation();
}

/** Parses an equation into its net form (repeats merged, species on both sides cancelled). */
export function parseEquation(text: string): Equation {
  const input = checkInput(text);
  return parseCached(input) ?? new EquationParser(input).equation();
}

/** Parses one term, e.g. `H2O(l)` or `1/2 O2(g)` (coefficient 1 when not written). */
export function parseTerm(text: string): Term {
  const parser = new EquationParser(checkInput(text));
  parser.skipSpace();
  if (parser.pos >= text.length) throw parseError('expected a species', parser.pos);
  const term = parser.term();
  parser.skipSpace();
  if (parser.pos < text.length) {
    throw parseError(`unexpected '${text[parser.pos]}' after the species`, parser.pos);
  }
  return term;
}
