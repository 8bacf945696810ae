import type { EnergyUnit } from '../../../shared/energy-unit';

/** One given reaction step with its enthalpy (in the request's unit). */
export interface HessStepInput {
  equation: string;
  deltaH: number;
  uncertainty?: number;
}

/** Body of `POST /api/v1/hess/solve`. */
export interface HessRequest {
  target: string;
  steps: HessStepInput[];
  unit?: EnergyUnit;
}

/** How one step enters the combination; `index` is 0-based into the request's steps. */
export interface HessStepUse {
  index: number;
  multiplier: number;
  flipped: boolean;
  scale: number;
  /** The step's contribution (multiplier × its ΔH) in the answer's unit. */
  deltaH: number;
}

/** Answer of `POST /api/v1/hess/solve`. */
export interface HessSolution {
  deltaH: number;
  uncertainty: number | null;
  unit: string;
  multipliers: number[];
  /** 0-based indices of steps the combination does not need. */
  unused: number[];
  steps: HessStepUse[];
}
