import type Fraction from 'fraction.js';
import { isElementSymbol } from './atomic-weights';
import { parseError, ThermoError } from '../errors/thermo-error';
import { chargeSuffix, countText, hillOrder } from './hill-formula';
import { frac, ONE, toNumber } from '../rational/rational';

/**
 * A chemical formula as written, reduced to its composition. `formula` is the canonical written
 * form (groups kept as written, `·` for the hydrate dot, counts of 1 dropped, charge as `+`, `-`,
 * `^2-`, a fractional hydrate multiplier as `1/2`): two spellings of one substance agree on it,
 * while isomers written differently (C2H5OH, CH3OCH3) stay apart. `elements` iterates in Hill
 * order.
 *
 * Counts may be non-integer: decimal subscripts (`Fe0.947O`) and fractional hydrate multipliers
 * (`CaSO4·1/2H2O`, `CaSO4·0.5H2O`). Then `exact` holds every count as an exact fraction and
 * `elements` the nearest floating-point values (for masses and display); code that needs exact
 * stoichiometry reads counts through `exactCounts`.
 */
export interface ParsedFormula {
  readonly formula: string;
  readonly elements: Readonly<Record<string, number>>;
  readonly charge: number;
  readonly hill: string;
  /** Present only when some count is not a whole number. */
  readonly exact?: Readonly<Record<string, Fraction>>;
}

/** Every count of a formula as an exact fraction (whole counts converted). */
export function exactCounts(
  formula: Pick<ParsedFormula, 'elements' | 'exact'>,
): Readonly<Record<string, Fraction>> {
  if (formula === null || typeof formula !== 'object' || typeof formula.elements !== 'object')
    throw new ThermoError('invalid_input', 'expected a parsed formula');
  if (formula.exact !== undefined) return formula.exact;
  const out: Record<string, Fraction> = {};
  for (const symbol in formula.elements) out[symbol] = frac(formula.elements[symbol] as number);
  return out;
}

export interface FormulaScan {
  readonly formula: ParsedFormula;
  /** Index just past the formula. */
  readonly end: number;
}

// Guards keep counts exact and far below 2^53 whatever the nesting.
const MAX_DIGITS = 6;
const MAX_TOTAL = 1e9;

type Counts = Map<string, Fraction>;
const HYDRATE_DOTS = '·*';

const isUpper = (c: string): boolean => c >= 'A' && c <= 'Z';
const isLower = (c: string): boolean => c >= 'a' && c <= 'z';
const isDigit = (c: string): boolean => c >= '0' && c <= '9';
const isSpace = (c: string): boolean => c === ' ' || c === '\t' || c === '\n' || c === '\r';

const CLOSER: Record<string, string> = { '(': ')', '[': ']' };

class Scanner {
  pos: number;

  /**
   * `inTerm`: the formula sits inside an equation term, so it ends where a phase `(g)`,
   * whitespace, a separator or an arrow begins, and a bare sign is a charge only when a
   * delimiter (end, space, phase, `=` or `→`) follows it, so `H2+O2` still reads as two species.
   */
  constructor(
    private readonly text: string,
    start: number,
    private readonly inTerm: boolean,
  ) {
    this.pos = start;
  }

  scan(): ParsedFormula {
    const totals: Counts = new Map();
    let canonical = '';
    let first = true;
    for (;;) {
      const partStart = this.pos;
      let multiplier = ONE;
      if (isDigit(this.peek())) {
        if (first) {
          throw parseError(
            'a formula starts with an element symbol or a bracket; a leading number is a coefficient and belongs to the equation',
            this.pos,
          );
        }
        multiplier = this.readMultiplier();
      }
      const part = this.sequence(null);
      if (part.text === '') {
        throw parseError(
          first ? 'expected an element symbol' : 'expected a formula after the hydrate dot',
          this.pos,
          { found: this.describe() },
        );
      }
      for (const [symbol, count] of part.counts)
        addCount(totals, symbol, count.mul(multiplier), partStart);
      canonical +=
        (first ? '' : '·') + (multiplier.equals(ONE) ? '' : multiplierText(multiplier)) + part.text;
      first = false;
      if (HYDRATE_DOTS.includes(this.peek()) && this.peek() !== '') {
        this.pos++;
        continue;
      }
      break;
    }
    const charge = this.charge();
    return buildFormula(totals, canonical, charge);
  }

  private sequence(closer: string | null): { counts: Counts; text: string } {
    const counts: Counts = new Map();
    let text = '';
    for (;;) {
      const c = this.peek();
      if (isUpper(c)) {
        const at = this.pos;
        let symbol = c;
        this.pos++;
        while (isLower(this.peek())) symbol += this.text[this.pos++];
        if (!isElementSymbol(symbol)) {
          throw new ThermoError(
            'unknown_element',
            `unknown element symbol ${symbol} at character ${at + 1}`,
            {
              position: at,
              symbol,
            },
          );
        }
        const n = isDigit(this.peek()) ? this.readCount() : ONE;
        addCount(counts, symbol, n, at);
        text += n.equals(ONE) ? symbol : symbol + countText(n);
      } else if (c === '(' || c === '[') {
        // "(" followed by a lowercase letter opens a phase label, never a group.
        if (c === '(' && isLower(this.text[this.pos + 1] ?? '')) break;
        const open = this.pos;
        this.pos++;
        const inner = this.sequence(CLOSER[c] as string);
        if (inner.text === '') throw parseError(`empty group '${c}${CLOSER[c]}'`, open);
        this.pos++; // the closer, checked by the inner sequence
        const n = isDigit(this.peek()) ? this.readCount() : ONE;
        for (const [symbol, count] of inner.counts) addCount(counts, symbol, count.mul(n), open);
        text += c + inner.text + CLOSER[c] + (n.equals(ONE) ? '' : countText(n));
      } else if (c === ')' || c === ']') {
        if (closer === c) return { counts, text };
        if (closer !== null) {
          throw parseError(`mismatched '${c}': expected '${closer}' to close the group`, this.pos);
        }
        throw parseError(`unexpected '${c}' with no group to close`, this.pos);
      } else {
        break;
      }
    }
    if (closer !== null) {
      throw parseError(`unclosed group: expected '${closer}'`, this.pos, {
        found: this.describe(),
      });
    }
    return { counts, text };
  }

  private charge(): number {
    const c = this.peek();
    if (c === '^') {
      const at = this.pos;
      this.pos++;
      let digits = '';
      let sign = '';
      if (this.peek() === '+' || this.peek() === '-') {
        sign = this.text[this.pos++] as string;
        while (isDigit(this.peek())) digits += this.text[this.pos++];
      } else {
        while (isDigit(this.peek())) digits += this.text[this.pos++];
        if (this.peek() === '+' || this.peek() === '-') sign = this.text[this.pos++] as string;
      }
      if (sign === '' || digits.length > 3 || (digits !== '' && Number(digits) === 0)) {
        throw parseError("expected a charge such as '^2-', '^3+' or '^+' after '^'", at);
      }
      const size = digits === '' ? 1 : Number(digits);
      return sign === '+' ? size : -size;
    }
    if (c === '+' || c === '-') {
      const next = this.text[this.pos + 1] ?? '';
      const delimited =
        next === '' ||
        (this.inTerm && (isSpace(next) || next === '(' || next === '=' || next === '→'));
      if (delimited) {
        this.pos++;
        return c === '+' ? 1 : -1;
      }
    }
    return 0;
  }

  /**
   * A count after an element or a group: `2`, or a decimal such as `0.947` (non-stoichiometric
   * phases). `CuSO4.5H2O` is refused rather than guessed: the period could be a hydrate dot.
   */
  private readCount(): Fraction {
    const at = this.pos;
    const whole = this.digits('count');
    if (this.peek() !== '.' || !isDigit(this.text[this.pos + 1] ?? '')) {
      if (whole === '0') throw parseError('a count must be greater than zero', at);
      return frac(Number(whole));
    }
    this.pos++;
    const decimals = this.fractionDigits();
    const next = this.peek();
    if (
      whole !== '0' &&
      (isUpper(next) || next === '[' || (next === '(' && !isLower(this.text[this.pos + 1] ?? '')))
    ) {
      throw parseError(
        `'${whole}.${decimals}' followed by more formula is ambiguous: write a hydrate with '·' or '*' (CuSO4·5H2O), and a decimal count last or in brackets ((Mn1.5)O2)`,
        at,
      );
    }
    return decimalCount(whole, decimals, at);
  }

  /** A hydrate multiplier: `5`, `0.5` or `1/2`. */
  private readMultiplier(): Fraction {
    const at = this.pos;
    const whole = this.digits('multiplier');
    let value: Fraction;
    if (this.peek() === '/' && isDigit(this.text[this.pos + 1] ?? '')) {
      this.pos++;
      const d = this.digits('denominator');
      if (Number(d) === 0) throw parseError('a fraction cannot have a zero denominator', at);
      value = frac(Number(whole), Number(d));
    } else if (this.peek() === '.' && isDigit(this.text[this.pos + 1] ?? '')) {
      this.pos++;
      value = decimalCount(whole, this.fractionDigits(), at);
    } else {
      value = frac(Number(whole));
    }
    if (value.n === 0n) throw parseError('a hydrate multiplier must be greater than zero', at);
    return value;
  }

  /** Whole-number digits, written as they are counted: no leading zeros (`01` → `1`). */
  private digits(what: string): string {
    const at = this.pos;
    let digits = '';
    while (isDigit(this.peek())) digits += this.text[this.pos++];
    if (digits.length > 1 && digits[0] === '0')
      throw parseError(`a ${what} is written without leading zeros`, at);
    if (digits.length > MAX_DIGITS) throw parseError(`${what} too large`, at);
    return digits;
  }

  private fractionDigits(): string {
    const at = this.pos;
    let digits = '';
    while (isDigit(this.peek())) digits += this.text[this.pos++];
    if (digits.length > MAX_DIGITS) throw parseError('too many decimal places', at);
    return digits;
  }

  peek(): string {
    return this.text[this.pos] ?? '';
  }

  describe(): string {
    const c = this.peek();
    return c === '' ? 'end of text' : `'${c}'`;
  }
}

function decimalCount(whole: string, decimals: string, at: number): Fraction {
  const value = frac(BigInt(whole + decimals), 10n ** BigInt(decimals.length));
  if (value.n === 0n) throw parseError('a count must be greater than zero', at);
  return value;
}

/** A hydrate multiplier as the canonical formula writes it: `5`, `1/2` (also for `0.5`). */
function multiplierText(f: Fraction): string {
  return f.d === 1n ? String(f.n) : `${f.n}/${f.d}`;
}

function addCount(map: Counts, symbol: string, n: Fraction, position: number): void {
  const prev = map.get(symbol);
  const total = prev === undefined ? n : prev.add(n);
  if (total.compare(MAX_TOTAL) > 0) throw parseError(`too many atoms of ${symbol}`, position);
  map.set(symbol, total);
}

function buildFormula(totals: Counts, canonical: string, charge: number): ParsedFormula {
  const elements: Record<string, number> = {};
  const exact: Record<string, Fraction> = {};
  let whole = true;
  let hill = '';
  for (const symbol of hillOrder(totals.keys())) {
    const n = totals.get(symbol) as Fraction;
    exact[symbol] = n;
    if (n.d !== 1n) whole = false;
    elements[symbol] = toNumber(n);
    hill += n.equals(ONE) ? symbol : symbol + countText(n);
  }
  const suffix = chargeSuffix(charge);
  return Object.freeze({
    formula: canonical + suffix,
    elements: Object.freeze(elements),
    charge,
    hill: hill + suffix,
    ...(whole ? {} : { exact: Object.freeze(exact) }),
  });
}

/** Scans a formula inside an equation term starting at `start`; the caller checks what follows. */
export function scanTermFormula(text: string, start: number): FormulaScan {
  const scanner = new Scanner(text, start, true);
  const formula = scanner.scan();
  return { formula, end: scanner.pos };
}

const cache = new Map<string, ParsedFormula>();
const CACHE_LIMIT = 20000;

/**
 * Parses a formula such as `CuSO4·5H2O`, `K4[Fe(CN)6]`, `SO4^2-`, `Na+`. Surrounding whitespace
 * is ignored; positions in errors index the text as given.
 */
export function parseFormula(text: string): ParsedFormula {
  if (typeof text !== 'string')
    throw new ThermoError('invalid_input', 'a formula must be a string');
  const hit = cache.get(text);
  if (hit !== undefined) return hit;
  let start = 0;
  while (start < text.length && isSpace(text[start] as string)) start++;
  let stop = text.length;
  while (stop > start && isSpace(text[stop - 1] as string)) stop--;
  if (start === stop) throw parseError('empty formula', start);
  const scanner = new Scanner(text.slice(0, stop), start, false);
  const formula = scanner.scan();
  if (scanner.pos < stop) {
    const c = text[scanner.pos] as string;
    const why =
      c === '('
        ? 'a phase label belongs to an equation term, not to a formula'
        : `unexpected '${c}'`;
    throw parseError(why, scanner.pos);
  }
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(text, formula);
  return formula;
}
