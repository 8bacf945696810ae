import type { HessAnswer } from '@contracts/calculate/calculate-schemas';

import { ApiError, readableMessage } from '../../../core/api-error';
import { withoutPosition } from '../equation-check';
import { exactValue, factorText } from '../exact-number';
import { typedDecimals } from '../../../shared/number-input/number-text';
import type { HessFormValue } from './hess-form';

/** One row of the result table: a step as the combination uses it. */
export interface UsedStep {
  /** 1-based, as the form numbers the steps. */
  readonly number: number;
  /** The step as used, plain text: reversed when the combination needs it, scaled, e.g. `½ × (…)`. */
  readonly usedAs: string;
  readonly reversed: boolean;
  /** The multiplier as people write it: `½`, `2`, `3/7`; `multiplier` is signed (−: reversed). */
  readonly factor: string;
  readonly multiplier: number;
  /** The step's own ΔH as given, and what it contributes (multiplier × ΔH), both formatted. */
  readonly given: string;
  readonly contribution: string;
}

export interface UnusedStep {
  readonly number: number;
  readonly equation: string;
}

export interface HessResultView {
  readonly target: string;
  readonly unit: string;
  readonly temperature: string;
  readonly total: string;
  readonly uncertainty: string | null;
  /** How the ± was combined, or why it was not. */
  readonly uncertaintyNote: string;
  readonly direction: 'exothermic' | 'endothermic' | 'thermoneutral';
  readonly used: readonly UsedStep[];
  readonly unused: readonly UnusedStep[];
  readonly alternatives: boolean;
}

/** Every outcome remembers the inputs (their key) it belongs to. */
export type HessOutcome =
  | { readonly kind: 'idle' }
  | { readonly kind: 'solving'; readonly key: string }
  | { readonly kind: 'solved'; readonly key: string; readonly view: HessResultView }
  | {
      readonly kind: 'failed';
      readonly key: string;
      readonly title: string;
      readonly message: string;
    };

export const IDLE: HessOutcome = { kind: 'idle' };

export const COMBINATION_METHOD =
  'root sum of squares of the independent step uncertainties, each scaled by its multiplier';

const MINUS = '\u2212';
/** An equation read backwards: products become reactants. */
export function reversed(equation: string): string {
  const [left, right] = equation.split(' -> ');
  return right === undefined ? equation : `${right} -> ${left}`;
}

/** Fixed decimals with a real minus sign; never `-0`. */
export function fixed(value: number, decimals: number, minus = MINUS): string {
  const text = (Math.abs(value) < 0.5 * 10 ** -decimals ? 0 : value).toFixed(decimals);
  return text.startsWith('-') ? minus + text.slice(1) : text;
}

/** The solution in the words and numbers the result shows, to the precision of its inputs. */
export function solvedView(value: HessFormValue, answer: HessAnswer): HessResultView {
  const used = answer.steps.filter((s) => exactValue(s.multiplier) !== 0);
  // As many decimals as the most precise ΔH typed for a used step (−283.0 stays −283.0).
  const decimals = Math.min(
    6,
    Math.max(0, ...used.map((s) => typedDecimals(value.steps[s.index]?.deltaH))),
  );
  const missing = used
    .filter((s) => (value.steps[s.index]?.uncertainty ?? '').trim() === '')
    .map((s) => s.index + 1);
  let uncertainty: string | null = null;
  if (answer.uncertainty !== null && missing.length === 0) {
    const shown = fixed(answer.uncertainty, decimals);
    uncertainty = Number(shown) === 0 ? answer.uncertainty.toPrecision(2) : shown;
  }
  const stepList = (numbers: number[]) =>
    numbers.length === 1
      ? `step ${numbers[0]} has none`
      : `steps ${numbers.slice(0, -1).join(', ')} and ${numbers.at(-1)} have none`;
  return {
    target: answer.target,
    unit: answer.unit,
    temperature: value.temperature.trim(),
    total: fixed(answer.deltaH, decimals),
    uncertainty,
    uncertaintyNote:
      uncertainty !== null
        ? `± combined as the ${COMBINATION_METHOD}.`
        : missing.length > 0
          ? `Uncertainty not combined: ${stepList(missing)}.`
          : 'Uncertainty not combined.',
    direction:
      answer.deltaH < 0 ? 'exothermic' : answer.deltaH > 0 ? 'endothermic' : 'thermoneutral',
    used: used.map((s) => {
      const equation = s.flipped ? reversed(s.equation) : s.equation;
      const factor = factorText(s.multiplier);
      return {
        number: s.index + 1,
        usedAs: factor === '1' ? equation : `${factor} × (${equation})`,
        reversed: s.flipped,
        factor,
        multiplier: exactValue(s.multiplier),
        given: fixed(s.deltaH / exactValue(s.multiplier), decimals),
        contribution: fixed(s.deltaH, decimals),
      };
    }),
    unused: answer.unused.map((index) => ({
      number: index + 1,
      equation: answer.steps[index]?.equation ?? value.steps[index]?.equation ?? '',
    })),
    alternatives: answer.alternativeSolutions,
  };
}

/** `steps[2].deltaH` → `Step 3 ΔH`: the form's own words and 1-based numbering. */
export function fieldName(field: unknown): string | null {
  if (typeof field !== 'string') return null;
  if (field === 'target') return 'Target equation';
  const step = /^steps\[(\d+)\]\.?(\w*)/.exec(field);
  if (!step) return null;
  const part = { equation: ' equation', deltaH: ' ΔH', uncertainty: ' ±' }[step[2]] ?? '';
  return `Step ${Number(step[1]) + 1}${part}`;
}

/** A refused or failed calculation in plain words, with the server's own message. */
export function failure(error: unknown): { title: string; message: string } {
  let message = readableMessage(error);
  const code = error instanceof ApiError ? error.code : null;
  if (error instanceof ApiError) {
    const where = fieldName(error.details['field']);
    const position = error.details['position'];
    message = withoutPosition(message);
    if (typeof position === 'number') message += ` (at character ${position + 1})`;
    // The server may name the place itself ("step 2 ΔH: …", "target: …"): say it once.
    if (where && !/\bstep \d|^target\b/i.test(message)) message = `${where}: ${message}`;
  }
  switch (code) {
    case 'no_combination':
      return { title: 'These steps cannot be combined into the target equation.', message };
    case 'not_unique':
      return {
        title:
          'These steps give the target in more than one way; remove the steps that repeat others.',
        message,
      };
    case 'parse_error':
    case 'unknown_element':
      return { title: 'One of the equations cannot be read.', message };
    case 'unbalanced':
      return { title: 'One of the equations is not balanced.', message };
    case 'validation_error':
      return { title: 'Some of the inputs are not valid.', message };
    default:
      return { title: 'The calculation did not complete.', message };
  }
}

/** The result as plain text, for pasting into a report or a message. */
export function resultText(view: HessResultView, link: string): string {
  const pm = view.uncertainty === null ? '' : ` ± ${view.uncertainty}`;
  return [
    `Target: ${view.target}`,
    `ΔrH°(${view.temperature} K) = ${view.total}${pm} ${view.unit} (${view.direction})`,
    ...view.used.map(
      (s) =>
        `Step ${s.number}${s.reversed ? ' (reversed)' : ''}: ${s.usedAs}   ${s.contribution} ${view.unit}`,
    ),
    ...view.unused.map((s) => `Step ${s.number} not used: ${s.equation}`),
    view.uncertaintyNote,
    `Reproduce: ${link}`,
  ].join('\n');
}

const csvCell = (cell: string) => (/[",\n]/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
const ascii = (number: string) => number.replace(MINUS, '-');

/** The result table as CSV (plain hyphen-minus, so spreadsheets read the numbers). */
export function resultCsv(view: HessResultView): string {
  const rows = [
    ['step', 'used as', 'multiplier', `step ΔH (${view.unit})`, `contribution (${view.unit})`],
    ...view.used.map((s) => [
      String(s.number),
      s.usedAs,
      String(Number(s.multiplier.toPrecision(12))),
      ascii(s.given),
      ascii(s.contribution),
    ]),
    ['total', view.target, '', '', ascii(view.total)],
  ];
  if (view.uncertainty !== null) rows.push(['uncertainty', '', '', '', view.uncertainty]);
  return rows.map((row) => row.map(csvCell).join(',')).join('\n') + '\n';
}
