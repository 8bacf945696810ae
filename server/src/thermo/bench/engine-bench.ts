/**
 * Engine throughput: parse + balance check + ΔrH° for a fixed, seeded set of 1,000 equations,
 * repeated on one core. Prints reactions per second; asserts nothing.
 *   npx tsx server/src/thermo/bench/engine-bench.ts      (npm run bench:engine)
 */
import { checkBalance } from '../balance/balance';
import { parseEquation } from '../equation/equation-parser';
import { reactionEnthalpy } from '../enthalpy/reaction-enthalpy';
import { benchEquations, benchLookup } from './equation-set';

const SET_SIZE = 1000;
const MIN_SECONDS = 2;

const texts = benchEquations(SET_SIZE);
const lookup = benchLookup();
const parsed = texts.map((t) => parseEquation(t));

function measure(label: string, work: (index: number) => number): number {
  let sink = 0;
  for (let warm = 0; warm < 20; warm++) for (let i = 0; i < texts.length; i++) sink += work(i);
  let done = 0;
  const start = process.hrtime.bigint();
  let elapsed = 0;
  while (elapsed < MIN_SECONDS) {
    for (let i = 0; i < texts.length; i++) sink += work(i);
    done += texts.length;
    elapsed = Number(process.hrtime.bigint() - start) / 1e9;
  }
  const rate = done / elapsed;
  const shown = Math.round(rate).toLocaleString('en-US').padStart(11);
  // The checksum keeps the work observable so it cannot be optimised away.
  console.log(`${label.padEnd(44)} ${shown} reactions/s   (checksum ${sink.toFixed(0)})`);
  return rate;
}

console.log(`Thalpos engine benchmark: ${texts.length} seeded equations, one core, e.g.`);
for (const t of texts.slice(0, 3)) console.log(`  ${t}`);
measure('parse only', (i) => parseEquation(texts[i] as string).reactants.length);
measure('balance check only (pre-parsed)', (i) => (checkBalance(parsed[i]!).balanced ? 1 : 0));
measure(
  'balance check + ΔrH° (pre-parsed)',
  (i) => reactionEnthalpy(parsed[i]!, lookup).deltaH / 1e6,
);
const headline = measure('parse + balance check + ΔrH°  (headline)', (i) => {
  // reactionEnthalpy checks the balance itself and returns the report with the result.
  const r = reactionEnthalpy(parseEquation(texts[i] as string), lookup);
  return (r.balance.balanced ? 1 : 0) + r.deltaH / 1e6;
});
console.log(`\n${Math.round(headline).toLocaleString('en-US')} reactions/s (target ≥ 200,000)`);
