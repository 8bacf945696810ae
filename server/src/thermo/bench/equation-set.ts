import { autoBalance } from '../balance/auto-balance';
import { netEquation, makeTerm, scaleEquation } from '../equation/equation-builder';
import { parseTerm } from '../equation/equation-parser';
import type { Equation, Term } from '../equation/equation-types';
import { printEquation } from '../equation/equation-printer';
import { combustionEquation } from '../enthalpy/heating-values';
import { frac } from '../rational/rational';
import type { FormationValue } from '../enthalpy/formation-data';

/**
 * A fixed, seeded set of equations for the engine benchmark, with an in-memory table of
 * formation enthalpies in kJ/mol, taken from check-values.md (the project's list of published
 * reference values): CODATA 1989 where it has the species, else OpenStax Chemistry 2e App. G.
 * The benchmark only needs realistic numbers; it asserts nothing.
 */
export const BENCH_VALUES_KJ: Readonly<Record<string, number>> = {
  'H2O(l)': -285.83,
  'H2O(g)': -241.826,
  'CO2(g)': -393.51,
  'CO(g)': -110.53,
  'CH4(g)': -74.87,
  'C2H6(g)': -84.0,
  'C3H8(g)': -103.8,
  'C2H4(g)': 52.4,
  'C2H2(g)': 227.4,
  'CH3OH(l)': -239.2,
  'CH3OH(g)': -201.0,
  'C2H5OH(l)': -277.6,
  'C6H6(l)': 49.1,
  'NH3(g)': -45.94,
  'NO(g)': 90.25,
  'NO2(g)': 33.2,
  'N2O(g)': 81.6,
  'SO2(g)': -296.81,
  'SO3(g)': -395.72,
  'H2S(g)': -20.6,
  'HCl(g)': -92.31,
  'HF(g)': -273.3,
  'NaCl(cr)': -411.2,
  'CaO(cr)': -634.92,
  'CaCO3(cr,calcite)': -1206.92,
  'Al2O3(cr,corundum)': -1675.7,
  'SiO2(cr,alpha quartz)': -910.7,
  'H2O2(l)': -187.78,
  'O3(g)': 142.7,
};

const FUELS = [
  'CH4(g)',
  'C2H6(g)',
  'C3H8(g)',
  'C2H4(g)',
  'C2H2(g)',
  'CH3OH(l)',
  'CH3OH(g)',
  'C2H5OH(l)',
  'C6H6(l)',
  'NH3(g)',
  'H2S(g)',
  'CO(g)',
];
const ELEMENTS = [
  'C(cr,graphite)',
  'H2(g)',
  'O2(g)',
  'N2(g)',
  'S(cr,rhombic)',
  'Cl2(g)',
  'F2(g)',
  'Na(cr)',
  'Ca(cr)',
  'Al(cr)',
  'Si(cr)',
];

/** mulberry32: small, fast, deterministic. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function formation(compound: Term): Equation | null {
  if (compound.species.kind !== 'formula') return null;
  const els = Object.keys(compound.species.elements);
  const reactants = ELEMENTS.map(parseTerm).filter(
    (t) =>
      t.species.kind === 'formula' && els.includes(Object.keys(t.species.elements)[0] as string),
  );
  if (reactants.length !== els.length) return null;
  const balanced = autoBalance(netEquation(reactants, [compound]));
  const k = (balanced.products[0] as Term).coefficient;
  return scaleEquation(balanced, k.inverse());
}

/** Varies the spelling the way people type: arrows, spacing, decimals for halves. */
function spell(eq: Equation, rnd: () => number): string {
  let text = printEquation(eq);
  const arrow = ['->', '=', '→'][Math.floor(rnd() * 3)] as string;
  text = text.replace(' -> ', rnd() < 0.5 ? ` ${arrow} ` : arrow);
  if (rnd() < 0.3) text = text.replace(/(^|\s)1\/2 /g, '$10.5 ');
  if (rnd() < 0.3) text = text.replace(/ \+ /g, '+');
  return text;
}

export function benchEquations(count: number, seed = 20260101): string[] {
  const rnd = seeded(seed);
  const pick = <T>(list: readonly T[]): T => list[Math.floor(rnd() * list.length)] as T;
  const species = Object.keys(BENCH_VALUES_KJ).map(parseTerm);
  const out: string[] = [];
  while (out.length < count) {
    const kind = rnd();
    let eq: Equation | null = null;
    try {
      if (kind < 0.4) {
        eq = combustionEquation(parseTerm(pick(FUELS)), rnd() < 0.5 ? 'l' : 'g');
      } else if (kind < 0.6) {
        eq = formation(pick(species));
      } else {
        // A random pair of reactants and products, balanced if the four species allow it.
        const four = [pick(species), pick(species), pick(species), pick(species)];
        eq = autoBalance(
          netEquation(
            four.slice(0, 2).map((t) => makeTerm(frac(1), t)),
            four.slice(2).map((t) => makeTerm(frac(1), t)),
          ),
        );
      }
    } catch {
      eq = null;
    }
    if (eq === null) continue;
    if (rnd() < 0.25) eq = scaleEquation(eq, frac(pick([2, 3, 1]), pick([1, 2])));
    out.push(spell(eq, rnd));
  }
  return out;
}

export function benchLookup(): (term: Term) => FormationValue | undefined {
  const table = new Map<string, FormationValue>();
  for (const [key, kj] of Object.entries(BENCH_VALUES_KJ)) {
    table.set(parseTerm(key).id, { value: kj * 1000, uncertainty: null });
  }
  return (term) => table.get(term.id);
}
