import starterSources from '../../../../imports/starter/sources.json';
import {
  formatCitation,
  normaliseDoi,
  parseBibtex,
  parseCsl,
  parseRis,
  toBibtex,
  toRis,
  type Csl,
} from './citation';

const starter = (id: string): Csl => {
  const found = (starterSources as Csl[]).find((s) => s.id === id);
  if (!found) throw new Error(`no starter source ${id}`);
  return found;
};

describe('formatCitation (CSL, the bundled style)', () => {
  // Expected strings: the starter sources as their publishers name them, in the style's order.
  it.each([
    [
      'codata-1989',
      'Cox, J. D., Wagman, D. D., & Medvedev, V. A. (1989). CODATA Key Values for Thermodynamics. Hemisphere Publishing Corp.',
    ],
    [
      'chase-1998',
      'Chase, M. W., Jr. (1998). Thermochemical Tables, Fourth Edition. In Journal of Physical and Chemical Reference Data, Monograph 9. American Chemical Society and American Institute of Physics.',
    ],
    [
      'openstax-chemistry-2e',
      'Flowers, P., Theopold, K., Langley, R., & Robinson, W. R. (2019). Chemistry 2e. OpenStax, Rice University. https://openstax.org/details/books/chemistry-2e',
    ],
    [
      'pedley-1986',
      'Pedley, J. B., Naylor, R. D., & Kirby, S. P. (1986). Thermochemical Data of Organic Compounds (2nd ed.). Chapman and Hall.',
    ],
  ])('formats the starter source %s', (id, expected) => {
    expect(formatCitation(starter(id))).toBe(expected);
  });

  it('keeps a suffix such as "Jr." whole (never "M. W. ,. J.")', () => {
    const text = formatCitation(starter('chase-1998'));
    expect(text).toContain('Chase, M. W., Jr. (1998)');
    expect(text).not.toMatch(/ ,|,\./);
  });

  it('lists a long author list (the NBS tables, eight authors) in full with the journal', () => {
    const text = formatCitation(starter('nbs-tables-1982'));
    expect(text).toMatch(/^Wagman, D\. D\., Evans, W\. H\., .* & Nuttall, R\. L\. \(1982\)\./);
    expect(text).toContain('Journal of Physical and Chemical Reference Data, 11(Supplement 2).');
  });

  it('ends with the DOI as a link', () => {
    const text = formatCitation({ type: 'article-journal', title: 'T', DOI: '10.5555/abc' });
    expect(text).toContain('https://doi.org/10.5555/abc');
  });
});

describe('BibTeX and RIS in and out', () => {
  const bibtex = `@article{kestrel2025,
  author = {Nandakumar, Priya and Brandt, Helga},
  title = {Bomb calorimetry of plant-grade methanol},
  journal = {Kestrel Process Notes},
  year = {2025},
  volume = {12},
  doi = {10.5555/Kestrel.Demo.2025.001}
}`;

  it('reads a BibTeX entry into CSL and writes it back with the same fields', () => {
    const csl = parseBibtex(bibtex);
    expect(csl).toMatchObject({
      type: 'article-journal',
      title: 'Bomb calorimetry of plant-grade methanol',
      author: [
        { family: 'Nandakumar', given: 'Priya' },
        { family: 'Brandt', given: 'Helga' },
      ],
      issued: { 'date-parts': [[2025]] },
    });
    const again = parseBibtex(toBibtex(csl));
    expect(again).toMatchObject({ title: csl.title, author: csl.author, issued: csl.issued });
    expect(String(again.DOI).toLowerCase()).toBe('10.5555/kestrel.demo.2025.001');
  });

  it('reads a RIS record and writes it back with the same fields', () => {
    const csl = parseRis(
      'TY  - JOUR\nAU  - Mensah, Kwame\nTI  - Heat capacity of a solvent blend\nPY  - 2024\nDO  - 10.5555/kpw.7\nER  - \n',
    );
    expect(csl).toMatchObject({ title: 'Heat capacity of a solvent blend', DOI: '10.5555/kpw.7' });
    const again = parseRis(toRis(csl));
    expect(again).toMatchObject({
      title: csl.title,
      author: [{ family: 'Mensah', given: 'Kwame' }],
      issued: { 'date-parts': [[2024]] },
      DOI: '10.5555/kpw.7',
    });
  });

  it('refuses unreadable input with a code, never an exception of its own', () => {
    expect(() => parseBibtex('@article{x, title={')).toThrow(
      expect.objectContaining({ status: 400, code: 'invalid_bibtex' }),
    );
    expect(() => parseBibtex('no entry here')).toThrow(
      expect.objectContaining({ code: 'invalid_bibtex' }),
    );
    expect(() => parseRis('hello')).toThrow(expect.objectContaining({ code: 'invalid_ris' }));
    expect(() => parseBibtex('@misc{k,}')).toThrow(
      expect.objectContaining({ status: 422, code: 'missing_title' }),
    );
    expect(() => parseBibtex('@misc{a, title={A}}\n@misc{b, title={B}}')).toThrow(
      expect.objectContaining({ status: 422, code: 'multiple_entries' }),
    );
  });

  it('never reads a URL pasted as BibTeX as something to fetch', () => {
    expect(() => parseBibtex('http://127.0.0.1:1/x.bib')).toThrow(
      expect.objectContaining({ code: 'invalid_bibtex' }),
    );
  });

  it('accepts CSL-JSON given by hand', () => {
    expect(
      parseCsl({ title: 'By hand', author: [{ literal: 'Kestrel Process Works' }] }),
    ).toMatchObject({
      type: 'document',
      title: 'By hand',
    });
  });
});

describe('normaliseDoi', () => {
  it.each([
    ['10.5555/ABC', '10.5555/abc'],
    [' doi:10.5555/x.y ', '10.5555/x.y'],
    ['https://doi.org/10.5555/Q', '10.5555/q'],
    ['http://dx.doi.org/10.5555/q', '10.5555/q'],
  ])('%s → %s', (input, doi) => expect(normaliseDoi(input)).toBe(doi));

  it.each(['', '10.1/x', 'not a doi', '10.5555/', '10.5555/a b', '10.5555/../x', '10.5555/a/.'])(
    'refuses %j',
    (input) => expect(normaliseDoi(input)).toBeNull(),
  );
});
