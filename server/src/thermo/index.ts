/**
 * Thalpos thermochemistry engine: formulas, equations, balance, Hess's law, Kirchhoff's law,
 * heating values. Pure computation (no I/O); data arrives through lookup callbacks. Energies are
 * J/mol unless a name says otherwise; stoichiometry is exact (fraction.js).
 */
export { ThermoError, isThermoError, type ThermoErrorCode } from './errors';

export {
  ATOMIC_WEIGHTS,
  ELEMENT_SYMBOLS,
  isElementSymbol,
  type AtomicWeight,
} from './atomic-weights';
export { parseFormula, type ParsedFormula } from './formula-parser';
export { hillFormula, hillOrder } from './hill-formula';
export { molarMass } from './molar-mass';
export {
  referenceStates,
  isReferenceState,
  matchReferenceState,
  type ReferenceState,
  type ReferenceMatch,
} from './reference-states';

export {
  PHASES,
  type Phase,
  type Species,
  type FormulaSpecies,
  type KeySpecies,
  type Term,
  type Equation,
  type Side,
} from './equation-types';
export { parseEquation, parseTerm, isRegistryKey } from './equation-parser';
export { printEquation, printTerm } from './equation-printer';
export {
  buildEquation,
  reverseEquation,
  scaleEquation,
  stoichiometry,
  speciesPhaseId,
} from './equation-builder';

export { checkBalance, assertBalanced, type BalanceReport } from './balance';
export { thermoJsonReplacer } from './json-replacer';
export { autoBalance } from './auto-balance';

export {
  tableLookup,
  UNCERTAINTY_BASES,
  type FormationValue,
  type FormationLookup,
  type UncertaintyBasis,
} from './formation-data';
export type { CombinedBasis } from './uncertainty';
export {
  reactionEnthalpy,
  type ReactionEnthalpy,
  type TermContribution,
  type BalanceOptions,
} from './reaction-enthalpy';
export {
  solveHess,
  type HessStep,
  type HessStepUse,
  type HessResult,
  type HessOptions,
} from './hess';
export {
  deriveFormationEnthalpy,
  type DerivedFormation,
  type DeriveOptions,
} from './derive-formation';

export {
  convertEnergy,
  toJoulesPerMole,
  fromJoulesPerMole,
  molarToSpecific,
  specificToMolar,
  THERMOCHEMICAL_CALORIE,
  GAS_CONSTANT,
  STANDARD_TEMPERATURE,
  type EnergyUnit,
  type SpecificEnergyUnit,
} from './units';
export {
  heatingValues,
  combustionEquation,
  type HeatingValues,
  type HeatingValue,
} from './heating-values';

export {
  heatCapacity,
  enthalpyIncrement,
  enthalpyChange,
  nasaEnthalpy,
  modelRange,
  validateModel,
  type HeatCapacityModel,
  type Nasa7Model,
  type ShomateModel,
  type ShomateRange,
  type TemperatureRange,
} from './heat-capacity';
export {
  reactionEnthalpyAtT,
  type PhaseTransition,
  type ThermalData,
  type TemperatureValue,
  type TemperatureLookup,
  type TermAtTemperature,
  type ReactionEnthalpyAtT,
} from './kirchhoff';
