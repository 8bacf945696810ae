import { isElementSymbol } from './atomic-weights';
import { parseError, ThermoError } from '../errors/thermo-error';
import { chargeSuffix, hillOrder } from './hill-formula';

/**
 * A chemical formula as written, reduced to its composition. `formula` is the canonical written
 * form (groups kept as written, `·` for the hydrate dot, counts of 1 dropped, charge as `+`, `-`,
 * `^2-`): two spellings of one substance agree on it, while isomers written differently
 * (C2H5OH, CH3OCH3) stay apart. `elements` iterates in Hill order.
 */
export interface ParsedFormula {
  readonly formula: string;
  readonly elements: Readonly<Record<string, number>>;
  readonly charge: number;
  readonly hill: string;
}

export interface FormulaScan {
  readonly formula: ParsedFormula;
  /** Index just past the formula. */
  readonly end: number;
}

// Guards keep counts exact integers far below 2^53 whatever the nesting.
const MAX_DIGITS = 6;
const MAX_TOTAL = 1e9;
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
    const totals = new Map<string, number>();
    let canonical = '';
    let first = true;
    for (;;) {
      const partStart = this.pos;
      let multiplier = 1;
      if (isDigit(this.peek())) {
        if (first) {
          throw parseError(
            'a formula starts with an element symbol or a bracket; a leading number is a coefficient and belongs to the equation',
            this.pos,
          );
        }
        multiplier = this.readCount();
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
        addCount(totals, symbol, count * multiplier, partStart);
      canonical += (first ? '' : '·') + (multiplier === 1 ? '' : String(multiplier)) + part.text;
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

  private sequence(closer: string | null): { counts: Map<string, number>; text: string } {
    const counts = new Map<string, number>();
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
            `unknown element symbol '${symbol}' at position ${at}`,
            {
              position: at,
              symbol,
            },
          );
        }
        const n = isDigit(this.peek()) ? this.readCount() : 1;
        addCount(counts, symbol, n, at);
        text += n === 1 ? symbol : symbol + n;
      } else if (c === '(' || c === '[') {
        // "(" followed by a lowercase letter opens a phase label, never a group.
        if (c === '(' && isLower(this.text[this.pos + 1] ?? '')) break;
        const open = this.pos;
        this.pos++;
        const inner = this.sequence(CLOSER[c] as string);
        if (inner.text === '') throw parseError(`empty group '${c}${CLOSER[c]}'`, open);
        this.pos++; // the closer, checked by the inner sequence
        const n = isDigit(this.peek()) ? this.readCount() : 1;
        for (const [symbol, count] of inner.counts) addCount(counts, symbol, count * n, open);
        text += c + inner.text + CLOSER[c] + (n === 1 ? '' : String(n));
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

  private readCount(): number {
    const at = this.pos;
    let digits = '';
    while (isDigit(this.peek())) digits += this.text[this.pos++];
    if (digits[0] === '0')
      throw parseError('a count must be a whole number of at least 1, without leading zeros', at);
    if (digits.length > MAX_DIGITS) throw parseError('count too large', at);
    return Number(digits);
  }

  peek(): string {
    return this.text[this.pos] ?? '';
  }

  describe(): string {
    const c = this.peek();
    return c === '' ? 'end of text' : `'${c}'`;
  }
}

function addCount(map: Map<string, number>, symbol: string, n: number, position: number): void {
  const total = (map.get(symbol) ?? 0) + n;
  if (total > MAX_TOTAL) throw parseError(`too many atoms of ${symbol}`, position);
  map.set(symbol, total);
}

function buildFormula(
  totals: Map<string, number>,
  canonical: string,
  charge: number,
): ParsedFormula {
  const elements: Record<string, number> = {};
  let hill = '';
  for (const symbol of hillOrder(totals.keys())) {
    const n = totals.get(symbol) as number;
    elements[symbol] = n;
    hill += n === 1 ? symbol : symbol + n;
  }
  const suffix = chargeSuffix(charge);
  return Object.freeze({
    formula: canonical + suffix,
    elements: Object.freeze(elements),
    charge,
    hill: hill + suffix,
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
