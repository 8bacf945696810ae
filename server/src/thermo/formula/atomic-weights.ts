/**
 * Element symbols (Z = 1…118) and the atomic weights used for molar masses, in g/mol.
 *
 * Source: IUPAC Commission on Isotopic Abundances and Atomic Weights (CIAAW), abridged standard
 * atomic weights, 2021 edition (five significant figures; conventional values for elements
 * whose standard atomic weight is an interval, e.g. H, C, N, O, S, Cl).
 * The values for H, C, N, O, F, Na, Al, Si, S, Cl, Ca and Fe were checked against a published
 * listing of that table; the others are from memory.
 *
 * Elements without a standard atomic weight (no stable isotope and no characteristic terrestrial
 * isotopic composition) carry the mass number of their longest-lived known isotope, the common
 * practice of periodic tables (marked `massNumber: true`). Those mass numbers are from memory; for
 * the superheavy elements the longest-lived isotope is still revised as new nuclides are made.
 * Tc-97 and Tc-98 have nearly equal half-lives; 97 is the figure IUPAC tables print.
 */
export interface AtomicWeight {
  readonly z: number;
  readonly symbol: string;
  readonly weight: number;
  readonly massNumber: boolean;
}

// [symbol, weight] in order of atomic number; a bracketed mass number is written as a negative
// number here only to keep the table one line per element — decoded below.
const TABLE: ReadonlyArray<readonly [string, number]> = [
  ['H', 1.008],
  ['He', 4.0026],
  ['Li', 6.94],
  ['Be', 9.0122],
  ['B', 10.81],
  ['C', 12.011],
  ['N', 14.007],
  ['O', 15.999],
  ['F', 18.998],
  ['Ne', 20.18],
  ['Na', 22.99],
  ['Mg', 24.305],
  ['Al', 26.982],
  ['Si', 28.085],
  ['P', 30.974],
  ['S', 32.06],
  ['Cl', 35.45],
  ['Ar', 39.95],
  ['K', 39.098],
  ['Ca', 40.078],
  ['Sc', 44.956],
  ['Ti', 47.867],
  ['V', 50.942],
  ['Cr', 51.996],
  ['Mn', 54.938],
  ['Fe', 55.845],
  ['Co', 58.933],
  ['Ni', 58.693],
  ['Cu', 63.546],
  ['Zn', 65.38],
  ['Ga', 69.723],
  ['Ge', 72.63],
  ['As', 74.922],
  ['Se', 78.971],
  ['Br', 79.904],
  ['Kr', 83.798],
  ['Rb', 85.468],
  ['Sr', 87.62],
  ['Y', 88.906],
  ['Zr', 91.224],
  ['Nb', 92.906],
  ['Mo', 95.95],
  ['Tc', -97],
  ['Ru', 101.07],
  ['Rh', 102.91],
  ['Pd', 106.42],
  ['Ag', 107.87],
  ['Cd', 112.41],
  ['In', 114.82],
  ['Sn', 118.71],
  ['Sb', 121.76],
  ['Te', 127.6],
  ['I', 126.9],
  ['Xe', 131.29],
  ['Cs', 132.91],
  ['Ba', 137.33],
  ['La', 138.91],
  ['Ce', 140.12],
  ['Pr', 140.91],
  ['Nd', 144.24],
  ['Pm', -145],
  ['Sm', 150.36],
  ['Eu', 151.96],
  ['Gd', 157.25],
  ['Tb', 158.93],
  ['Dy', 162.5],
  ['Ho', 164.93],
  ['Er', 167.26],
  ['Tm', 168.93],
  ['Yb', 173.05],
  ['Lu', 174.97],
  ['Hf', 178.49],
  ['Ta', 180.95],
  ['W', 183.84],
  ['Re', 186.21],
  ['Os', 190.23],
  ['Ir', 192.22],
  ['Pt', 195.08],
  ['Au', 196.97],
  ['Hg', 200.59],
  ['Tl', 204.38],
  ['Pb', 207.2],
  ['Bi', 208.98],
  ['Po', -209],
  ['At', -210],
  ['Rn', -222],
  ['Fr', -223],
  ['Ra', -226],
  ['Ac', -227],
  ['Th', 232.04],
  ['Pa', 231.04],
  ['U', 238.03],
  ['Np', -237],
  ['Pu', -244],
  ['Am', -243],
  ['Cm', -247],
  ['Bk', -247],
  ['Cf', -251],
  ['Es', -252],
  ['Fm', -257],
  ['Md', -258],
  ['No', -259],
  ['Lr', -266],
  ['Rf', -267],
  ['Db', -268],
  ['Sg', -269],
  ['Bh', -270],
  ['Hs', -269],
  ['Mt', -278],
  ['Ds', -281],
  ['Rg', -282],
  ['Cn', -285],
  ['Nh', -286],
  ['Fl', -289],
  ['Mc', -290],
  ['Lv', -293],
  ['Ts', -294],
  ['Og', -294],
];

export const ATOMIC_WEIGHTS: ReadonlyMap<string, AtomicWeight> = new Map(
  TABLE.map(([symbol, w], i) => [
    symbol,
    Object.freeze({ z: i + 1, symbol, weight: Math.abs(w), massNumber: w < 0 }),
  ]),
);

export const ELEMENT_SYMBOLS: readonly string[] = Object.freeze(TABLE.map(([symbol]) => symbol));

export function isElementSymbol(symbol: string): boolean {
  return ATOMIC_WEIGHTS.has(symbol);
}
