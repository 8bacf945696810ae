import type Fraction from 'fraction.js';
import { isTerm } from '../equation/checked-equations';
import { ThermoError } from '../errors/thermo-error';
import { netEquation, makeTerm } from '../equation/equation-builder';
import { parseTerm } from '../equation/equation-parser';
import type { Equation, FormulaSpecies, Term } from '../equation/equation-types';
import { tableLookup, type FormationLookup, type FormationValue } from './formation-data';
import { exactCounts } from '../formula/formula-parser';
import { molarMass } from '../formula/molar-mass';
import { isZero, ONE, sign, ZERO } from '../rational/rational';
import { reactionEnthalpy, type ReactionEnthalpy } from './reaction-enthalpy';

export interface HeatingValue {
  /** Heat released per mole of fuel, J/mol (positive: −ΔcH°). */
  readonly perMol: number;
  /** Heat released per kilogram of fuel, J/kg. */
  readonly perKg: number;
  readonly equation: Equation;
  /** The combustion enthalpy with its term-by-term breakdown. */
  readonly combustion: ReactionEnthalpy;
}

export interface HeatingValues {
  readonly fuel: Term;
  /** g/mol. */
  readonly molarMass: number;
  /** Moles of water formed per mole of fuel. */
  readonly waterPerMol: Fraction;
  /** Higher heating value: water formed as liquid. */
  readonly hhv: HeatingValue;
  /** Lower heating value: water formed as vapour. */
  readonly lhv: HeatingValue;
}

const ALLOWED = new Set(['C', 'H', 'O', 'N', 'S']);
const term = (text: string): Term => parseTerm(text);
const O2 = term('O2(g)');
const CO2 = term('CO2(g)');
const N2 = term('N2(g)');
const SO2 = term('SO2(g)');
const WATER = { l: term('H2O(l)'), g: term('H2O(g)') };

/**
 * Combustion equation of a C/H/O/N/S fuel in oxygen to CO2(g), H2O(l or g), N2(g) and SO2(g),
 * per mole of fuel: CcHhOoNnSs + (c + h/4 + s − o/2) O2 → c CO2 + h/2 H2O + n/2 N2 + s SO2.
 */
export function combustionEquation(fuel: Term, water: 'l' | 'g'): Equation {
  if (!isTerm(fuel))
    throw new ThermoError('invalid_input', 'the fuel must be a term such as CH4(g)');
  if (water !== 'l' && water !== 'g')
    throw new ThermoError('invalid_input', "water must be 'l' or 'g'");
  if (fuel.species.kind !== 'formula') {
    throw new ThermoError(
      'invalid_input',
      `the composition of ${fuel.id} is unknown; a fuel needs a formula`,
      { species: fuel.id },
    );
  }
  if (fuel.species.charge !== 0)
    throw new ThermoError('invalid_input', 'a fuel must be a neutral species', {
      species: fuel.id,
    });
  const els = fuel.species.elements;
  const others = Object.keys(els).filter((s) => !ALLOWED.has(s));
  if (others.length > 0) {
    throw new ThermoError(
      'invalid_input',
      `heating values cover fuels of C, H, O, N and S only; ${fuel.id} contains ${others.join(', ')}`,
      {
        species: fuel.id,
        elements: others,
      },
    );
  }
  const exact = exactCounts(fuel.species);
  const [c, h, o, n, s] = ['C', 'H', 'O', 'N', 'S'].map((e) => exact[e] ?? ZERO) as [
    Fraction,
    Fraction,
    Fraction,
    Fraction,
    Fraction,
  ];
  if (isZero(c.add(h).add(s)))
    throw new ThermoError('invalid_input', `${fuel.id} contains nothing to burn`, {
      species: fuel.id,
    });
  const oxygen = c.mul(4).add(h).add(s.mul(4)).sub(o.mul(2)).div(4);
  const reactants = [makeTerm(ONE, fuel)];
  const products: Term[] = [];
  if (!isZero(c)) products.push(makeTerm(c, CO2));
  if (!isZero(h)) products.push(makeTerm(h.div(2), WATER[water]));
  if (!isZero(n)) products.push(makeTerm(n.div(2), N2));
  if (!isZero(s)) products.push(makeTerm(s, SO2));
  // A fuel richer in oxygen than its products need releases O2.
  if (sign(oxygen) > 0) reactants.push(makeTerm(oxygen, O2));
  else if (sign(oxygen) < 0) products.push(makeTerm(oxygen.neg(), O2));
  try {
    return netEquation(reactants, products);
  } catch {
    throw new ThermoError('invalid_input', `${fuel.id} is already fully oxidised`, {
      species: fuel.id,
    });
  }
}

/**
 * HHV and LHV of a fuel (e.g. 'CH4(g)', 'C8H18(l)') per mole and per kilogram. Formation values
 * come from a lookup or a table keyed by term text ('CH4(g)', 'CO2(g)', 'H2O(l)', 'H2O(g)',
 * 'SO2(g)'), in J/mol.
 */
export function heatingValues(
  fuel: string | Term,
  data: FormationLookup | Readonly<Record<string, number | FormationValue>>,
): HeatingValues {
  const fuelTerm = typeof fuel === 'string' ? parseTerm(fuel) : fuel;
  const lookup: FormationLookup = typeof data === 'function' ? data : tableLookup(data);
  const equations = { l: combustionEquation(fuelTerm, 'l'), g: combustionEquation(fuelTerm, 'g') };
  // combustionEquation has checked that the fuel has a formula.
  const species = fuelTerm.species as FormulaSpecies;
  const m = molarMass(species);
  const value = (water: 'l' | 'g'): HeatingValue => {
    const equation = equations[water];
    const combustion = reactionEnthalpy(equation, lookup);
    return {
      perMol: -combustion.deltaH,
      perKg: (-combustion.deltaH * 1000) / m,
      equation,
      combustion,
    };
  };
  return {
    fuel: fuelTerm,
    molarMass: m,
    waterPerMol: (exactCounts(species)['H'] ?? ZERO).div(2),
    hhv: value('l'),
    lhv: value('g'),
  };
}
