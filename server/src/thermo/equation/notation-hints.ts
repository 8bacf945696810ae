import { toEquation } from './equation-input';
import type { Equation, FormulaSpecies } from './equation-types';

/**
 * Hints for readings that are correct by the syntax yet a common slip. A bare sign after a count
 * is a charge of one: `Fe2+` reads as Fe₂ with charge +1 (as documented), and `SO42-` as SO₄₂
 * with charge −1, where the writer most likely meant `Fe^2+` and `SO4^2-`. The reading stands;
 * the hint only asks. Polyatomic ions with a one-digit last count (`HSO4-`, `NO3-`) get no hint.
 */
export function notationHints(input: Equation | string): string[] {
  const eq = toEquation(input);
  const hints: string[] = [];
  for (const term of [...eq.reactants, ...eq.products]) {
    if (term.species.kind !== 'formula') continue;
    const hint = chargeHint(term.species);
    if (hint !== null && !hints.includes(hint)) hints.push(hint);
  }
  return hints;
}

function chargeHint(species: FormulaSpecies): string | null {
  if (Math.abs(species.charge) !== 1) return null;
  const m = /^(.*?[A-Za-z\])])(\d+)([+-])$/.exec(species.formula);
  if (m === null) return null;
  const [, body, count, sign] = m as unknown as [string, string, string, '+' | '-'];
  const monatomic = Object.keys(species.elements).length === 1 && /^[A-Z][a-z]?$/.test(body);
  let meant: string;
  if (monatomic) {
    meant = `${body}^${count}${sign}`;
  } else if (count.length >= 2 && count.at(-1)! >= '2' && count.at(-1)! <= '4') {
    meant = `${body}${count.slice(0, -1)}^${count.at(-1)}${sign}`;
  } else {
    return null;
  }
  const charge = sign === '+' ? '+1' : '−1';
  return `did you mean ${meant}? ${species.formula} reads as ${body}${count} with charge ${charge}`;
}
