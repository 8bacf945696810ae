import type { Nasa7Model } from '../temperature/heat-capacity';

/**
 * NASA 7-coefficient data from GRI-Mech 3.0 (Smith et al., 1999), as transcribed in
 * check-values.md, the project's list of published reference values. Ranges 200/1000/3500 K;
 * N2 300/1000/5000 K and the H2 high range are marked there as from memory.
 */
export const GRI_O2: Nasa7Model = {
  kind: 'nasa7',
  tLow: 200,
  tMid: 1000,
  tHigh: 3500,
  low: [
    3.78245636, -2.99673416e-3, 9.84730201e-6, -9.68129509e-9, 3.24372837e-12, -1.06394356e3,
    3.65767573,
  ],
  high: [
    3.28253784, 1.48308754e-3, -7.57966669e-7, 2.09470555e-10, -2.16717794e-14, -1.08845772e3,
    5.45323129,
  ],
};

export const GRI_N2: Nasa7Model = {
  kind: 'nasa7',
  tLow: 300,
  tMid: 1000,
  tHigh: 5000,
  low: [3.298677, 1.4082404e-3, -3.963222e-6, 5.641515e-9, -2.444854e-12, -1.0208999e3, 3.950372],
  high: [2.92664, 1.4879768e-3, -5.68476e-7, 1.0097038e-10, -6.753351e-15, -9.227977e2, 5.980528],
};

export const GRI_H2: Nasa7Model = {
  kind: 'nasa7',
  tLow: 200,
  tMid: 1000,
  tHigh: 3500,
  low: [
    2.34433112, 7.98052075e-3, -1.9478151e-5, 2.01572094e-8, -7.37611761e-12, -9.17935173e2,
    6.83010238e-1,
  ],
  high: [
    3.3372792, -4.94024731e-5, 4.99456778e-7, -1.79566394e-10, 2.00255376e-14, -9.50158922e2,
    -3.20502331,
  ],
};

export const GRI_H2O: Nasa7Model = {
  kind: 'nasa7',
  tLow: 200,
  tMid: 1000,
  tHigh: 3500,
  low: [
    4.19864056, -2.0364341e-3, 6.52040211e-6, -5.48797062e-9, 1.77197817e-12, -3.02937267e4,
    -8.49032208e-1,
  ],
  high: [
    3.03399249, 2.17691804e-3, -1.64072518e-7, -9.7041987e-11, 1.68200992e-14, -3.00042971e4,
    4.9667701,
  ],
};

export const GRI_CO2: Nasa7Model = {
  kind: 'nasa7',
  tLow: 200,
  tMid: 1000,
  tHigh: 3500,
  low: [
    2.35677352, 8.98459677e-3, -7.12356269e-6, 2.45919022e-9, -1.43699548e-13, -4.83719697e4,
    9.90105222,
  ],
  high: [
    3.85746029, 4.41437026e-3, -2.21481404e-6, 5.23490188e-10, -4.72084164e-14, -4.8759166e4,
    2.27163806,
  ],
};

export const GRI_CH4: Nasa7Model = {
  kind: 'nasa7',
  tLow: 200,
  tMid: 1000,
  tHigh: 3500,
  low: [
    5.14987613, -1.36709788e-2, 4.91800599e-5, -4.84743026e-8, 1.66693956e-11, -1.02466476e4,
    -4.64130376,
  ],
  high: [
    7.4851495e-2, 1.33909467e-2, -5.73285809e-6, 1.22292535e-9, -1.0181523e-13, -9.46834459e3,
    1.8437318e1,
  ],
};

/**
 * C2H2 from GRI-Mech 3.0, from memory (not in check-values.md). Checked for self-consistency: H at
 * 298.15 K reproduces ΔfH° = 228.2 kJ/mol (the value Molecular Energetics uses) and the two
 * ranges meet at 1000 K.
 */
export const GRI_C2H2_FROM_MEMORY: Nasa7Model = {
  kind: 'nasa7',
  tLow: 200,
  tMid: 1000,
  tHigh: 3500,
  low: [
    8.08681094e-1, 2.33615629e-2, -3.55171815e-5, 2.80152437e-8, -8.50072974e-12, 2.64289807e4,
    1.39397051e1,
  ],
  high: [
    4.14756964, 5.96166664e-3, -2.37294852e-6, 4.67412171e-10, -3.61235213e-14, 2.59359992e4,
    -1.23028121,
  ],
};
