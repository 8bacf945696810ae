import { ThermoError } from '../errors/thermo-error';
import type { Phase } from '../equation/equation-types';
import { parseFormula, type ParsedFormula } from '../formula/formula-parser';

/**
 * Reference state of each element at 298.15 K and p° = 1 bar: the form whose standard enthalpy
 * of formation is zero by definition.
 *
 * Source: the conventions of the CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev
 * 1989) and the NBS tables (Wagman et al., J. Phys. Chem. Ref. Data 11, Suppl. 2, 1982): the
 * most stable form at 298.15 K, with the named exceptions below. Radioactive elements whose
 * bulk form is little studied follow their group by analogy (Fr); At is omitted, see below.
 *
 * - C is graphite, not diamond (ΔfH°(diamond) = +1.895 kJ/mol, NBS tables, from memory).
 * - P is white phosphorus by convention although red and black are more stable; some tables
 *   use red phosphorus instead. Here: white.
 * - S is rhombic (orthorhombic α) sulfur; Sn is white (β) tin, stable above 286 K.
 * - Ga (m.p. 302.9 K), Cs (301.6 K) and Rb (312.5 K) are crystalline at 298.15 K; Fr is taken
 *   as crystalline by analogy with Cs (no bulk sample has ever been studied).
 * - Br2 and Hg are the liquids; I2 is crystalline; noble gases are monatomic gases.
 * - At (no bulk sample, state unknown) and elements after Am (only atoms made, no agreed
 *   condensed phase) are omitted.
 */
export interface ReferenceState {
  readonly symbol: string;
  /** Formula as tables write the reference form: "O2", "C", "Br2". */
  readonly formula: string;
  /** Atoms per formula unit of the reference form (2 for O2, 1 for crystals). */
  readonly atoms: number;
  readonly phase: Phase;
  /** Named polymorph when the convention names one, else null (the stable crystal). */
  readonly modification: string | null;
  /** Other spellings of the modification label that mean the same form. */
  readonly aliases: readonly string[];
}

const DIATOMIC_GASES = ['H', 'N', 'O', 'F', 'Cl'];
const MONATOMIC_GASES = ['He', 'Ne', 'Ar', 'Kr', 'Xe', 'Rn'];
const NAMED: Record<string, { modification: string; aliases: string[] }> = {
  C: { modification: 'graphite', aliases: [] },
  P: { modification: 'white', aliases: [] },
  S: { modification: 'rhombic', aliases: ['orthorhombic'] },
  Sn: { modification: 'white', aliases: ['beta', 'β'] },
};
// Crystalline elements at 298.15 K (everything up to Am except the gases, liquids and At).
const CRYSTALS =
  'Li Be B C Na Mg Al Si P S K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Rb Sr Y Zr Nb Mo Tc Ru Rh ' +
  'Pd Ag Cd In Sn Sb Te I Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os Ir Pt Au ' +
  'Tl Pb Bi Po Fr Ra Ac Th Pa U Np Pu Am';

function entry(symbol: string, atoms: number, phase: Phase): ReferenceState {
  const named = NAMED[symbol];
  return Object.freeze({
    symbol,
    formula: atoms === 1 ? symbol : `${symbol}${atoms}`,
    atoms,
    phase,
    modification: named?.modification ?? null,
    aliases: Object.freeze(named?.aliases ?? []),
  });
}

export const referenceStates: Readonly<Record<string, ReferenceState>> = Object.freeze(
  Object.fromEntries([
    ...DIATOMIC_GASES.map((s) => [s, entry(s, 2, 'g')] as const),
    ...MONATOMIC_GASES.map((s) => [s, entry(s, 1, 'g')] as const),
    ['Br', entry('Br', 2, 'l')],
    ['Hg', entry('Hg', 1, 'l')],
    ['I', entry('I', 2, 'cr')],
    ...CRYSTALS.split(' ')
      .filter((s) => s !== 'I')
      .map((s) => [s, entry(s, 1, 'cr')] as const),
  ]),
);

export interface ReferenceMatch {
  readonly reference: boolean;
  /** The match relied on an unwritten phase or modification (e.g. `O2` or `C(cr)`). */
  readonly assumed: boolean;
}

const NOT_REFERENCE: ReferenceMatch = Object.freeze({ reference: false, assumed: false });
const EXACT: ReferenceMatch = Object.freeze({ reference: true, assumed: false });
const ASSUMED: ReferenceMatch = Object.freeze({ reference: true, assumed: true });

/**
 * Whether formula + phase (+ modification) is an element in its reference state.
 * - Gases must have the reference atomicity (O2, not O or O3); a condensed element may be
 *   written with any count (S8(cr,rhombic) is the same substance as S(cr,rhombic), I(cr) is
 *   half a mole of I2(cr)), since its ΔfH° is zero per any amount.
 * - Phase `s` counts as crystalline. An unwritten phase (null) or modification is read as the
 *   reference one, and the match says it was assumed.
 * - A modification other than the reference one (C(cr,diamond)) is not the reference state; for
 *   elements whose convention names none, any written modification is left to the data.
 */
export function matchReferenceState(
  formula: string | ParsedFormula,
  phase: Phase | null,
  modification: string | null = null,
): ReferenceMatch {
  if (phase !== null && typeof phase !== 'string')
    throw new ThermoError('invalid_input', 'phase must be a string or null');
  if (modification !== null && typeof modification !== 'string')
    throw new ThermoError('invalid_input', 'modification must be a string or null');
  const parsed = typeof formula === 'string' ? parseFormula(formula) : formula;
  if (
    parsed === null ||
    typeof parsed !== 'object' ||
    parsed.elements === null ||
    typeof parsed.elements !== 'object'
  ) {
    throw new ThermoError('invalid_input', 'expected a formula (text or parsed)');
  }
  if (parsed.charge !== 0) return NOT_REFERENCE;
  let symbol: string | undefined;
  for (const s in parsed.elements) {
    if (symbol !== undefined) return NOT_REFERENCE;
    symbol = s;
  }
  const ref = symbol === undefined ? undefined : referenceStates[symbol];
  if (ref === undefined) return NOT_REFERENCE;
  const atoms = parsed.elements[ref.symbol] as number;
  if (ref.phase === 'g' && atoms !== ref.atoms) return NOT_REFERENCE;
  let assumed = false;
  if (phase === null) assumed = true;
  else if (!(phase === ref.phase || (phase === 's' && ref.phase === 'cr'))) return NOT_REFERENCE;
  else if (phase === 's') assumed = true;
  if (modification === null) {
    if (ref.modification !== null) assumed = true;
  } else {
    const label = modification.toLowerCase();
    if (ref.modification === null) return NOT_REFERENCE;
    if (label !== ref.modification && !ref.aliases.includes(label)) return NOT_REFERENCE;
  }
  return assumed ? ASSUMED : EXACT;
}

export function isReferenceState(
  formula: string | ParsedFormula,
  phase: Phase | null,
  modification: string | null = null,
): boolean {
  if (phase !== null && typeof phase !== 'string')
    throw new ThermoError('invalid_input', 'phase must be a string or null');
  return matchReferenceState(formula, phase, modification).reference;
}
