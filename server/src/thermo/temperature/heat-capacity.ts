import { shown, ThermoError } from '../errors/thermo-error';
import { GAS_CONSTANT, STANDARD_TEMPERATURE } from '../enthalpy/units';

/**
 * NASA 7-coefficient polynomials (McBride, Gordon & Reno, NASA TM-4513, 1993), two ranges
 * meeting at tMid:
 *   Cp/R = a1 + a2·T + a3·T² + a4·T³ + a5·T⁴
 *   H/(RT) = a1 + a2·T/2 + a3·T²/3 + a4·T³/4 + a5·T⁴/5 + a6/T
 * With a6 on the usual basis, H(298.15 K) reproduces ΔfH°.
 */
export interface Nasa7Model {
  readonly kind: 'nasa7';
  readonly tLow: number;
  readonly tMid: number;
  readonly tHigh: number;
  /** a1…a7 for tLow ≤ T ≤ tMid. */
  readonly low: readonly number[];
  /** a1…a7 for tMid ≤ T ≤ tHigh. */
  readonly high: readonly number[];
}

/**
 * One range of the Shomate equation (Shomate 1954), t = T/1000:
 *   Cp = A + B·t + C·t² + D·t³ + E/t²                       J/(mol·K)
 *   H° − H°(298.15) = A·t + B·t²/2 + C·t³/3 + D·t⁴/4 − E/t + F − H   kJ/mol
 * F and H are optional: without them the increment is the integral of Cp from 298.15 K.
 */
export interface ShomateRange {
  readonly tMin: number;
  readonly tMax: number;
  readonly A: number;
  readonly B: number;
  readonly C: number;
  readonly D: number;
  readonly E: number;
  readonly F?: number;
  readonly H?: number;
}

export interface ShomateModel {
  readonly kind: 'shomate';
  /** Contiguous ranges in increasing temperature. */
  readonly ranges: readonly ShomateRange[];
}

export type HeatCapacityModel = Nasa7Model | ShomateModel;

/**
 * Tables start many ranges at 298 or 300 K; the 298.15 K reference point may lie up to this far
 * below a model's lowest temperature and is then evaluated on the lowest range (an extrapolation
 * of under 2 K, the common practice with such data).
 */
const REFERENCE_SLACK = 2;

export interface TemperatureRange {
  readonly min: number;
  readonly max: number;
}

function bad(message: string): ThermoError {
  return new ThermoError('invalid_input', message);
}

const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** Checks the shape of a model; every function here calls it first. */
export function validateModel(model: HeatCapacityModel): HeatCapacityModel {
  if (model === null || typeof model !== 'object')
    throw bad('a heat-capacity model must be an object');
  if (model.kind === 'nasa7') {
    const { tLow, tMid, tHigh, low, high } = model;
    if (![tLow, tMid, tHigh].every(finite) || !(tLow > 0 && tLow < tMid && tMid < tHigh)) {
      throw bad('a NASA 7-coefficient model needs 0 < tLow < tMid < tHigh');
    }
    if (
      !Array.isArray(low) ||
      !Array.isArray(high) ||
      low.length !== 7 ||
      high.length !== 7 ||
      ![...low, ...high].every(finite)
    ) {
      throw bad('a NASA 7-coefficient model needs 7 + 7 finite coefficients');
    }
    return model;
  }
  if (model.kind === 'shomate') {
    const ranges = model.ranges;
    if (!Array.isArray(ranges) || ranges.length === 0)
      throw bad('a Shomate model needs at least one range');
    const withFH = ranges.filter((r) => r.F !== undefined || r.H !== undefined).length;
    if (withFH !== 0 && withFH !== ranges.length)
      throw bad('give F and H for every Shomate range or for none');
    ranges.forEach((r, i) => {
      const values = [r.tMin, r.tMax, r.A, r.B, r.C, r.D, r.E, ...(withFH ? [r.F, r.H] : [])];
      if (!values.every(finite) || !(r.tMin > 0 && r.tMin < r.tMax))
        throw bad(`Shomate range ${i} is malformed`);
      if (i > 0 && r.tMin !== (ranges[i - 1] as ShomateRange).tMax)
        throw bad('Shomate ranges must be contiguous and increasing');
    });
    return model;
  }
  throw bad(`unknown heat-capacity model kind ${shown((model as { kind?: unknown }).kind)}`);
}

export function modelRange(model: HeatCapacityModel): TemperatureRange {
  validateModel(model);
  if (model.kind === 'nasa7') return { min: model.tLow, max: model.tHigh };
  return {
    min: (model.ranges[0] as ShomateRange).tMin,
    max: (model.ranges[model.ranges.length - 1] as ShomateRange).tMax,
  };
}

function checkTemperature(model: HeatCapacityModel, T: number): void {
  if (!finite(T) || T <= 0) throw bad('temperature must be a positive number of kelvin');
  const { min, max } = modelRange(model);
  const lowest =
    T === STANDARD_TEMPERATURE && min - STANDARD_TEMPERATURE <= REFERENCE_SLACK
      ? STANDARD_TEMPERATURE
      : min;
  if (T < lowest || T > max) {
    throw new ThermoError('out_of_range', `${T} K is outside the model's range ${min}–${max} K`, {
      temperature: T,
      range: { min, max },
    });
  }
}

function nasaCoefficients(model: Nasa7Model, T: number): readonly number[] {
  return T <= model.tMid ? model.low : model.high;
}

/** Absolute H(T) of a NASA model in J/mol (on the basis of its a6; ΔfH° at 298.15 K usually). */
export function nasaEnthalpy(model: Nasa7Model, T: number): number {
  checkTemperature(model, T);
  const [a1, a2, a3, a4, a5, a6] = nasaCoefficients(model, T) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  return GAS_CONSTANT * (T * (a1 + T * (a2 / 2 + T * (a3 / 3 + T * (a4 / 4 + T * (a5 / 5))))) + a6);
}

function shomateRangeAt(model: ShomateModel, T: number): ShomateRange {
  for (const r of model.ranges) if (T <= r.tMax) return r;
  return model.ranges[model.ranges.length - 1] as ShomateRange;
}

/** ∫Cp dT antiderivative of one Shomate range, kJ/mol. */
function shomateAntiderivative(r: ShomateRange, T: number): number {
  const t = T / 1000;
  return t * (r.A + t * (r.B / 2 + t * (r.C / 3 + t * (r.D / 4)))) - r.E / t;
}

/**
 * Shomate H(T) in J/mol on the model's own basis: the published H° − H°(298.15) when F and H
 * are given, else the integral of Cp from the lowest temperature of the model.
 */
function shomateEnthalpy(model: ShomateModel, T: number): number {
  const first = model.ranges[0] as ShomateRange;
  if (first.F !== undefined) {
    const r = shomateRangeAt(model, T);
    return 1000 * (shomateAntiderivative(r, T) + (r.F as number) - (r.H as number));
  }
  let total = 0;
  for (const r of model.ranges) {
    // The first range also covers the slack below its tMin (then the term is negative).
    if (r === first || T > r.tMin)
      total += shomateAntiderivative(r, Math.min(T, r.tMax)) - shomateAntiderivative(r, r.tMin);
    if (T <= r.tMax) break;
  }
  return 1000 * total;
}

function enthalpyOnBasis(model: HeatCapacityModel, T: number): number {
  return model.kind === 'nasa7' ? nasaEnthalpy(model, T) : shomateEnthalpy(model, T);
}

/** Cp(T) in J/(mol·K). */
export function heatCapacity(model: HeatCapacityModel, T: number): number {
  validateModel(model);
  checkTemperature(model, T);
  if (model.kind === 'nasa7') {
    const [a1, a2, a3, a4, a5] = nasaCoefficients(model, T) as [
      number,
      number,
      number,
      number,
      number,
    ];
    return GAS_CONSTANT * (a1 + T * (a2 + T * (a3 + T * (a4 + T * a5))));
  }
  const r = shomateRangeAt(model, T);
  const t = T / 1000;
  return r.A + t * (r.B + t * (r.C + t * r.D)) + r.E / (t * t);
}

/** H(T2) − H(T1) within one model, J/mol. */
export function enthalpyChange(model: HeatCapacityModel, T1: number, T2: number): number {
  validateModel(model);
  checkTemperature(model, T1);
  checkTemperature(model, T2);
  return enthalpyOnBasis(model, T2) - enthalpyOnBasis(model, T1);
}

/**
 * H°(T) − H°(298.15 K) in J/mol. For Shomate ranges with F and H this is the published
 * expression itself (A·t + … − E/t + F − H), whose value at 298.15 K is zero only to the
 * precision of the fitted F.
 */
export function enthalpyIncrement(model: HeatCapacityModel, T: number): number {
  validateModel(model);
  if (model.kind === 'shomate' && (model.ranges[0] as ShomateRange).F !== undefined) {
    checkTemperature(model, T);
    return shomateEnthalpy(model, T);
  }
  return enthalpyChange(model, STANDARD_TEMPERATURE, T);
}
