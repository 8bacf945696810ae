import { STANDARD_TEMPERATURE_K } from './reaction-query';

/** One temperature of the ΔrH(T) curve; `deltaH` is null where the release has no data. */
export interface SweepPoint {
  readonly temperatureK: number;
  readonly deltaH: number | null;
}

/** Lowest and highest temperature asked for, and the spacing between them. */
const FROM_K = 100;
const TO_K = 6000;
const STEP_K = 100;

/**
 * Temperatures to ask the batch route for: a 100 K grid over 100–6000 K (wider than heat-capacity
 * sets usually reach, so the answers themselves show where the data end), plus 298.15 K and the
 * temperature the user asked for.
 */
export function sweepTemperatures(requestedK: number): number[] {
  const grid = new Set<number>([STANDARD_TEMPERATURE_K, requestedK]);
  for (let t = FROM_K; t <= TO_K; t += STEP_K) grid.add(t);
  return [...grid].sort((a, b) => a - b);
}

/**
 * The unbroken run of answered points around the requested temperature: the range the release's
 * data cover. Points outside it (refused as out of range or missing data) are dropped, so the
 * curve never joins across a gap.
 */
export function coveredRun(points: readonly SweepPoint[], requestedK: number): SweepPoint[] {
  const sorted = [...points].sort((a, b) => a.temperatureK - b.temperatureK);
  const anchor = sorted.findIndex((p) => p.temperatureK === requestedK && p.deltaH !== null);
  if (anchor === -1) return [];
  let first = anchor;
  let last = anchor;
  while (first > 0 && sorted[first - 1].deltaH !== null) first -= 1;
  while (last < sorted.length - 1 && sorted[last + 1].deltaH !== null) last += 1;
  return sorted.slice(first, last + 1);
}
