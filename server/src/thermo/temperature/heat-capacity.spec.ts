import {
  enthalpyChange,
  enthalpyIncrement,
  heatCapacity,
  modelRange,
  nasaEnthalpy,
  type ShomateModel,
} from './heat-capacity';
import { GRI_CO2, GRI_N2, GRI_O2 } from '../testing/gri-mech-species';
import { GAS_CONSTANT } from '../enthalpy/units';

// A constant heat capacity of 29.1 J/(mol·K) (about that of a diatomic gas) makes exact checks easy.
const constant: ShomateModel = {
  kind: 'shomate',
  ranges: [{ tMin: 250, tMax: 2000, A: 29.1, B: 0, C: 0, D: 0, E: 0 }],
};

describe('NASA 7-coefficient polynomials', () => {
  it('evaluates Cp = R·(a1 + a2T + a3T² + a4T³ + a5T⁴) on the right range', () => {
    const T = 500;
    const [a1, a2, a3, a4, a5] = GRI_O2.low as number[];
    expect(heatCapacity(GRI_O2, T)).toBeCloseTo(
      GAS_CONSTANT * (a1! + a2! * T + a3! * T ** 2 + a4! * T ** 3 + a5! * T ** 4),
      10,
    );
    const [b1, b2, b3, b4, b5] = GRI_O2.high as number[];
    expect(heatCapacity(GRI_O2, 2000)).toBeCloseTo(
      GAS_CONSTANT * (b1! + b2! * 2000 + b3! * 2000 ** 2 + b4! * 2000 ** 3 + b5! * 2000 ** 4),
      10,
    );
  });

  it('has H(T) whose slope is Cp', () => {
    for (const T of [400, 800, 1500, 3000]) {
      const h = 1e-3;
      const slope = enthalpyChange(GRI_CO2, T - h, T + h) / (2 * h);
      expect(slope).toBeCloseTo(heatCapacity(GRI_CO2, T), 4);
    }
  });

  it('gives zero increment at 298.15 K and a rising one above', () => {
    expect(enthalpyIncrement(GRI_O2, 298.15)).toBe(0);
    const values = [400, 600, 1000, 2000, 3500].map((T) => enthalpyIncrement(GRI_O2, T));
    expect(values.every((v, i) => i === 0 || v > (values[i - 1] as number))).toBe(true);
    expect(enthalpyIncrement(GRI_O2, 250)).toBeLessThan(0);
  });

  it('evaluates the 298.15 K reference point of a range that starts at 300 K', () => {
    expect(modelRange(GRI_N2)).toEqual({ min: 300, max: 5000 });
    expect(enthalpyIncrement(GRI_N2, 1000)).toBeGreaterThan(0);
    expect(() => enthalpyIncrement(GRI_N2, 299)).toThrow(
      expect.objectContaining({ code: 'out_of_range' }),
    );
  });

  it('fails out_of_range outside the model, naming the range', () => {
    expect(() => enthalpyIncrement(GRI_O2, 4000)).toThrow(
      expect.objectContaining({
        code: 'out_of_range',
        details: { temperature: 4000, range: { min: 200, max: 3500 } },
      }),
    );
    expect(() => heatCapacity(GRI_O2, 150)).toThrow(
      expect.objectContaining({ code: 'out_of_range' }),
    );
  });

  it('gives the absolute enthalpy on the basis of a6', () => {
    expect(nasaEnthalpy(GRI_CO2, 298.15)).toBeLessThan(-390e3);
  });

  it('rejects malformed models', () => {
    expect(() => heatCapacity({ ...GRI_O2, low: [1, 2, 3] }, 500)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => heatCapacity({ ...GRI_O2, tMid: 100 }, 500)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => heatCapacity({ kind: 'cubic' } as never, 500)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => heatCapacity(GRI_O2, Number.NaN)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});

describe('Shomate equation', () => {
  it('integrates a constant heat capacity exactly', () => {
    expect(heatCapacity(constant, 700)).toBe(29.1);
    expect(enthalpyIncrement(constant, 1298.15)).toBeCloseTo(29.1 * 1000, 6);
    expect(enthalpyIncrement(constant, 298.15)).toBe(0);
  });

  it('includes the E/t² term', () => {
    const m: ShomateModel = {
      kind: 'shomate',
      ranges: [{ tMin: 250, tMax: 2000, A: 0, B: 0, C: 0, D: 0, E: 2 }],
    };
    expect(heatCapacity(m, 500)).toBeCloseTo(2 / 0.25, 12);
    // ∫ E/t² dT = 1000·E·(1/t1 − 1/t2) J/mol
    expect(enthalpyIncrement(m, 1000)).toBeCloseTo(1000 * 2 * (1 / 0.29815 - 1), 6);
  });

  it('integrates across contiguous ranges', () => {
    const twoRanges: ShomateModel = {
      kind: 'shomate',
      ranges: [
        { tMin: 250, tMax: 1000, A: 30, B: 0, C: 0, D: 0, E: 0 },
        { tMin: 1000, tMax: 3000, A: 40, B: 0, C: 0, D: 0, E: 0 },
      ],
    };
    expect(enthalpyIncrement(twoRanges, 2000)).toBeCloseTo(30 * (1000 - 298.15) + 40 * 1000, 6);
    expect(heatCapacity(twoRanges, 1500)).toBe(40);
  });

  it('uses the published F and H when given: H° − H°298.15 = At + Bt²/2 + Ct³/3 + Dt⁴/4 − E/t + F − H', () => {
    // Illustrative coefficients (not a fitted species): the formula is what is under test.
    const r = { tMin: 298, tMax: 1200, A: 25, B: 8, C: -2, D: 0.3, E: 0.1, F: -8.5, H: 0 };
    const m: ShomateModel = { kind: 'shomate', ranges: [r] };
    const t = 0.9;
    const expected =
      r.A * t + (r.B * t ** 2) / 2 + (r.C * t ** 3) / 3 + (r.D * t ** 4) / 4 - r.E / t + r.F - r.H;
    expect(enthalpyIncrement(m, 900)).toBeCloseTo(expected * 1000, 9);
  });

  it('rejects gaps between ranges and partial F/H', () => {
    const gap: ShomateModel = {
      kind: 'shomate',
      ranges: [
        { ...constant.ranges[0]!, tMax: 900 },
        { ...constant.ranges[0]!, tMin: 1000 },
      ],
    };
    expect(() => enthalpyIncrement(gap, 500)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    const partial: ShomateModel = { kind: 'shomate', ranges: [{ ...constant.ranges[0]!, F: 1 }] };
    expect(() => enthalpyIncrement(partial, 500)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
    expect(() => enthalpyIncrement({ kind: 'shomate', ranges: [] }, 500)).toThrow(
      expect.objectContaining({ code: 'invalid_input' }),
    );
  });
});
