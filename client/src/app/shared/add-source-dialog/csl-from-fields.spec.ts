import { cslFromFields, namesFromLines } from './csl-from-fields';

const empty = {
  type: 'report',
  title: '',
  authors: '',
  year: '',
  container: '',
  volume: '',
  issue: '',
  pages: '',
  publisher: '',
  doi: '',
  url: '',
};

describe('cslFromFields', () => {
  it('reads people as "Family, Given" and other lines as organisations', () => {
    expect(namesFromLines('Brandt, Helga\n\n  Kestrel Process Works \nSørensen,')).toEqual([
      { family: 'Brandt', given: 'Helga' },
      { literal: 'Kestrel Process Works' },
      { family: 'Sørensen' },
    ]);
  });

  it('builds CSL-JSON with only the fields filled in', () => {
    expect(
      cslFromFields({
        ...empty,
        title: ' Plant trial notes ',
        authors: 'Reyes, Tomas',
        year: '2026',
        publisher: 'Kestrel Process Works',
        doi: '10.5555/x',
      }),
    ).toEqual({
      type: 'report',
      title: 'Plant trial notes',
      author: [{ family: 'Reyes', given: 'Tomas' }],
      issued: { 'date-parts': [[2026]] },
      publisher: 'Kestrel Process Works',
      DOI: '10.5555/x',
    });
  });

  it('leaves out a year that is not a year', () => {
    expect(cslFromFields({ ...empty, title: 'T', year: 'last spring' })).toEqual({
      type: 'report',
      title: 'T',
    });
  });
});
