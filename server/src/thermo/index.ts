/**
 * Thalpos thermochemistry engine: formulas, equations, balance, Hess's law, Kirchhoff's law,
 * heating values. Pure computation (no I/O); data arrives through lookup callbacks. Energies are
 * J/mol unless a name says otherwise; stoichiometry is exact (fraction.js).
 *
 * Layers, lowest first (each folder imports only its own and lower ones; ESLint enforces it):
 * errors → rational → formula → equation → balance → enthalpy → temperature. The rest of the
 * server imports the engine from this file only.
 */
export {
  ThermoError,
  isThermoError,
  THERMO_ERROR_CODES,
  type ThermoErrorCode,
} from './errors/thermo-error';

export {
  ATOMIC_WEIGHTS,
  ELEMENT_SYMBOLS,
  isElementSymbol,
  type AtomicWeight,
} from './formula/atomic-weights';
export { parseFormula, exactCounts, type ParsedFormula } from './formula/formula-parser';
export { hillFormula, hillOrder } from './formula/hill-formula';
export { molarMass } from './formula/molar-mass';
export {
  referenceStates,
  isReferenceState,
  matchReferenceState,
  type ReferenceState,
  type ReferenceMatch,
} from './enthalpy/reference-states';

export {
  PHASES,
  phaseName,
  type Phase,
  type Species,
  type FormulaSpecies,
  type KeySpecies,
  type Term,
  type Equation,
  type Side,
} from './equation/equation-types';
export { parseEquation, parseTerm, isRegistryKey } from './equation/equation-parser';
export { notationHints } from './equation/notation-hints';
export { printEquation, printTerm } from './equation/equation-printer';
export {
  buildEquation,
  reverseEquation,
  scaleEquation,
  stoichiometry,
  speciesPhaseId,
} from './equation/equation-builder';

export { checkBalance, assertBalanced, type BalanceReport } from './balance/balance';
export { thermoJsonReplacer } from './rational/json-replacer';
export { fractionText } from './rational/rational';
export { autoBalance } from './balance/auto-balance';

export {
  tableLookup,
  UNCERTAINTY_BASES,
  type FormationValue,
  type FormationLookup,
  type UncertaintyBasis,
} from './enthalpy/formation-data';
export type { CombinedBasis } from './enthalpy/uncertainty';
export {
  reactionEnthalpy,
  type ReactionEnthalpy,
  type TermContribution,
  type BalanceOptions,
} from './enthalpy/reaction-enthalpy';
export {
  solveHess,
  type HessStep,
  type HessStepUse,
  type HessResult,
  type HessOptions,
} from './enthalpy/hess';
export {
  deriveFormationEnthalpy,
  type DerivedFormation,
  type DeriveOptions,
} from './enthalpy/derive-formation';

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
} from './enthalpy/units';
export {
  heatingValues,
  combustionEquation,
  type HeatingValues,
  type HeatingValue,
} from './enthalpy/heating-values';

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
} from './temperature/heat-capacity';
export {
  reactionEnthalpyAtT,
  type PhaseTransition,
  type ThermalData,
  type TemperatureValue,
  type TemperatureLookup,
  type TermAtTemperature,
  type ReactionEnthalpyAtT,
} from './temperature/kirchhoff';
