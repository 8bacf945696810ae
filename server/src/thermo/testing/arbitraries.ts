import fc from 'fast-check';
import { ELEMENT_SYMBOLS } from '../formula/atomic-weights';

/** fast-check generators of formula and equation text for the engine's property tests. */

const COMMON = ['C', 'H', 'O', 'N', 'S', 'Cl', 'Na', 'Fe', 'Ca', 'Cu', 'P', 'K', 'Al', 'Si', 'Mg'];

export const elementSymbol = fc.oneof(
  { weight: 4, arbitrary: fc.constantFrom(...COMMON) },
  { weight: 1, arbitrary: fc.constantFrom(...ELEMENT_SYMBOLS) },
);

const count = fc.oneof(
  { weight: 6, arbitrary: fc.constant('') },
  { weight: 6, arbitrary: fc.integer({ min: 1, max: 12 }).map(String) },
  // Non-integer subscripts (non-stoichiometric phases); a whole part of 0 is never ambiguous.
  { weight: 1, arbitrary: fc.constantFrom('0.5', '0.947', '0.25') },
);

const atom = fc.tuple(elementSymbol, count).map(([s, n]) => s + n);

const group: fc.Arbitrary<string> = fc.letrec<{ group: string; body: string }>((tie) => ({
  body: fc
    .array(fc.oneof({ weight: 3, arbitrary: atom }, { weight: 1, arbitrary: tie('group') }), {
      minLength: 1,
      maxLength: 3,
    })
    .map((xs) => xs.join('')),
  group: fc
    .tuple(fc.constantFrom(['(', ')'], ['[', ']']), tie('body'), count)
    .map(([[open, close], body, n]) => `${open}${body}${close}${n}`),
})).group;

const formulaBody = fc
  .array(fc.oneof({ weight: 4, arbitrary: atom }, { weight: 1, arbitrary: group }), {
    minLength: 1,
    maxLength: 4,
  })
  .map((xs) => xs.join(''));

export const charge = fc.constantFrom('', '', '', '+', '-', '^2-', '^3+', '^2+', '^-', '^+');

/** Formula text: optional hydrate part with multiplier, optional charge. */
export const formulaText = fc
  .tuple(
    formulaBody,
    fc.option(
      fc.tuple(
        fc.constantFrom('·', '*'),
        fc.constantFrom('', '2', '5', '10', '1/2', '0.5', '3/2'),
        formulaBody,
      ),
    ),
    charge,
  )
  .map(([body, hydrate, z]) => body + (hydrate === null ? '' : hydrate.join('')) + z)
  // A trailing (S), (Cr) or (Am) group is refused as a phase written in capitals.
  .filter((text) => !/\((S|Cr|Am)1?\)1?$/.test(text));

export const registryKey = fc
  .tuple(
    fc.constantFrom('n-', '2-methyl', 'iso', 'cis-', 'trans-', '1,3-', 'x', 'b'),
    fc.stringMatching(/^[a-z][a-z0-9-]{0,10}$/),
  )
  .map(([a, b]) => a + b);

const modification = fc.constantFrom(
  'graphite',
  'diamond',
  'calcite',
  'rhombic',
  'alpha quartz',
  'I',
  'white',
);

export const phaseText = fc.oneof(
  fc.constant(''),
  fc.constantFrom('(g)', '(l)', '(cr)', '(s)', '(am)', '(aq)'),
  fc.tuple(fc.constantFrom('cr', 's', 'am'), modification).map(([p, m]) => `(${p},${m})`),
  // Our own notation: a modification's name alone stands for its crystal.
  modification.filter((m) => m !== 'I').map((m) => `(${m})`),
);

export const coefficientText = fc.oneof(
  fc.constant(''),
  fc.integer({ min: 1, max: 30 }).map((n) => `${n} `),
  fc
    .tuple(fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 8 }))
    .map(([n, d]) => `${n}/${d} `),
  fc.constantFrom('0.5 ', '1.5 ', '0.25 ', '2.75 '),
);

export const speciesText = fc.oneof(
  { weight: 5, arbitrary: formulaText },
  { weight: 1, arbitrary: registryKey.map((k) => `[${k}]`) },
);

export const termText = fc
  .tuple(coefficientText, speciesText, phaseText)
  .map(([c, s, p]) => c + s + p);

export const arrowText = fc.constantFrom(' -> ', ' = ', ' → ', '->', '=', '→');

export const equationText = fc
  .tuple(
    fc.array(termText, { minLength: 1, maxLength: 4 }),
    arrowText,
    fc.array(termText, { minLength: 1, maxLength: 4 }),
  )
  .map(([r, arrow, p]) => {
    const left = r.join(' + ');
    // A bare '-' glued to '->' would be read as the arrow's first character, so space it.
    const a = /[+-]$/.test(left) && arrow === '->' ? ' -> ' : arrow;
    return `${left}${a}${p.join(' + ')}`;
  });

/** Characters that exercise every branch of the grammar, for mutation fuzzing. */
export const GRAMMAR_CHARS = '()[]^+-=>→·*0123456789/., abcglrsqCHONaSFeXx\t';

export const mutatedText = (base: fc.Arbitrary<string>): fc.Arbitrary<string> =>
  fc
    .tuple(
      base,
      fc.array(
        fc.tuple(
          fc.nat(),
          fc.constantFrom('insert', 'delete', 'replace'),
          fc.constantFrom(...GRAMMAR_CHARS),
        ),
        { maxLength: 4 },
      ),
    )
    .map(([text, edits]) => {
      let out = text;
      for (const [at, op, c] of edits) {
        const i = out.length === 0 ? 0 : at % out.length;
        if (op === 'insert') out = out.slice(0, i) + c + out.slice(i);
        else if (op === 'delete') out = out.slice(0, i) + out.slice(i + 1);
        else out = out.slice(0, i) + c + out.slice(i + 1);
      }
      return out;
    });
