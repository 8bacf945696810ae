import type Fraction from 'fraction.js';
import * as builder from './equation-builder';
import type { TermTemplate } from './equation-builder';
import type { Equation, Term } from './equation-types';
import * as rational from '../rational/rational';

/*
 * The equation parser's token scanner, its caches of parsed tokens and coefficients, and the
 * cached fast path for text made only of known tokens. Everything the fast path touches lives in
 * this module or is bound once below: module loaders used in development wrap each imported
 * binding in a getter, which on this path cost more than the parsing itself.
 */
const { makeTerm, netEquation } = builder;
const { frac, ONE } = rational;

// Character codes for the hot path (charCodeAt past the end gives NaN, which matches nothing).
export const SPACE = 32,
  TAB = 9,
  LF = 10,
  CR = 13,
  ZERO_CODE = 48,
  NINE = 57,
  LOWER_A = 97,
  LOWER_Z = 122;
export const OPEN = 40,
  CLOSE = 41,
  OPEN_SQ = 91,
  CLOSE_SQ = 93,
  PLUS = 43,
  MINUS = 45,
  EQUALS = 61,
  GREATER = 62;
export const ARROW = 0x2192;
export const spaceCode = (c: number): boolean => c === SPACE || c === TAB || c === LF || c === CR;
export const digitCode = (c: number): boolean => c >= ZERO_CODE && c <= NINE;
export const lowerCode = (c: number): boolean => c >= LOWER_A && c <= LOWER_Z;

export const templateCache = new Map<string, TermTemplate>();
export const coefficientCache = new Map<string, Fraction>();
const CACHE_LIMIT = 20000;

export function remember<V>(cache: Map<string, V>, key: string, value: V): void {
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(key, value);
}

/**
 * Where the species-and-phase token starting at `start` ends, without building anything; used as
 * the cache key. It mirrors the grammar (brackets, phase label, the bare-sign charge rule) so that
 * a token text always parses the same way wherever it appears.
 */
export function tokenExtent(text: string, start: number): number {
  const length = text.length;
  let i = start;
  let depth = 0;
  while (i < length) {
    const c = text.charCodeAt(i);
    if (depth > 0) {
      if (c === OPEN || c === OPEN_SQ) depth++;
      else if (c === CLOSE || c === CLOSE_SQ) depth--;
      i++;
      continue;
    }
    if (spaceCode(c) || c === EQUALS || c === ARROW || c === CLOSE || c === CLOSE_SQ) break;
    if (c === OPEN && lowerCode(text.charCodeAt(i + 1))) {
      const close = text.indexOf(')', i);
      return close < 0 ? length : close + 1;
    }
    if (c === OPEN || c === OPEN_SQ) depth++;
    else if (c === PLUS || c === MINUS) {
      const next = text.charCodeAt(i + 1);
      if (!(
        i + 1 === length ||
        spaceCode(next) ||
        next === OPEN ||
        next === EQUALS ||
        next === ARROW
      ))
        break;
    }
    i++;
  }
  return i;
}

const DOT = 46;
const SLASH = 47;

/**
 * The common case without the parser object: every token already in the caches, well-formed
 * separators. Anything else (a new token, an error, an unusual coefficient) returns null and
 * the full parser runs from the start, so results and error messages are the full parser's.
 */
export function parseCached(text: string): Equation | null {
  const length = text.length;
  const reactants: Term[] = [];
  const products: Term[] = [];
  let side = reactants;
  let pos = 0;
  for (;;) {
    while (spaceCode(text.charCodeAt(pos))) pos++;
    let coefficient = ONE;
    const c = text.charCodeAt(pos);
    if (digitCode(c)) {
      const start = pos;
      while (digitCode(text.charCodeAt(pos))) pos++;
      const sep = text.charCodeAt(pos);
      if (sep === DOT || sep === SLASH) {
        pos++;
        while (digitCode(text.charCodeAt(pos))) pos++;
        const cached = coefficientCache.get(text.slice(start, pos));
        if (cached === undefined) return null;
        coefficient = cached;
      } else if (pos === start + 1 && c !== ZERO_CODE) {
        coefficient = frac(c - ZERO_CODE);
      } else {
        const cached = coefficientCache.get(text.slice(start, pos));
        if (cached === undefined) return null;
        coefficient = cached;
      }
      while (spaceCode(text.charCodeAt(pos))) pos++;
    }
    const extent = tokenExtent(text, pos);
    if (extent === pos) return null;
    const template = templateCache.get(text.slice(pos, extent));
    if (template === undefined) return null;
    side.push(makeTerm(coefficient, template));
    pos = extent;
    while (spaceCode(text.charCodeAt(pos))) pos++;
    if (pos >= length) break;
    const next = text.charCodeAt(pos);
    if (next === PLUS) {
      pos++;
    } else if (side === reactants && (next === EQUALS || next === ARROW)) {
      pos++;
      side = products;
    } else if (side === reactants && next === MINUS && text.charCodeAt(pos + 1) === GREATER) {
      pos += 2;
      side = products;
    } else {
      return null;
    }
  }
  if (side !== products || products.length === 0) return null;
  return netEquation(reactants, products);
}
