import { formatCitation } from './citation-format';

describe('formatCitation', () => {
  it('formats authors, year, title, container, volume and pages, and the DOI', () => {
    expect(
      formatCitation({
        title: 'Heats of combustion at Kestrel',
        author: [
          { family: 'Okafor', given: 'Ngozi Ada' },
          { family: 'Lindqvist', given: 'Per-Erik' },
        ],
        issued: { 'date-parts': [[2024, 3]] },
        'container-title': 'Kestrel Process Notes',
        volume: '12',
        issue: '2',
        page: '101-117',
        DOI: '10.9999/KPW.2024.7',
      }),
    ).toBe(
      'Okafor, N. A.; Lindqvist, P.-E. (2024). Heats of combustion at Kestrel. Kestrel Process Notes 12(2), 101-117. https://doi.org/10.9999/kpw.2024.7',
    );
  });

  it('keeps a name suffix and shortens long author lists', () => {
    const many = ['A', 'B', 'C', 'D', 'E'].map((f) => ({ family: f, given: 'X.' }));
    expect(formatCitation({ title: 'T', author: [{ family: 'Reyes', given: 'M. W., Jr.' }] })).toBe(
      'Reyes, M. W., Jr. T.',
    );
    expect(formatCitation({ title: 'T', author: many, issued: { 'date-parts': [[1999]] } })).toBe(
      'A, X. et al. (1999). T.',
    );
  });

  it('uses editors, ordinal editions and the publisher; never invents missing parts', () => {
    expect(
      formatCitation({
        title: 'Tables of the plant',
        editor: [{ literal: 'Kestrel Process Works data team' }],
        edition: '2',
        publisher: 'Kestrel Press',
      }),
    ).toBe(
      'Kestrel Process Works data team (ed.). Tables of the plant. 2nd edition. Kestrel Press.',
    );
    expect(formatCitation({})).toBe('Untitled source');
  });
});
