/** The "by hand" fields of the Add source dialog, as typed. */
export interface SourceFields {
  readonly type: string;
  readonly title: string;
  /** One person per line, "Family, Given"; a line without a comma is an organisation. */
  readonly authors: string;
  readonly year: string;
  readonly container: string;
  readonly volume: string;
  readonly issue: string;
  readonly pages: string;
  readonly publisher: string;
  readonly doi: string;
  readonly url: string;
}

export type CslName = { family: string; given?: string } | { literal: string };

export function namesFromLines(text: string): CslName[] {
  return text
    .split('\n')
    .map((line) => line.trim())
    .filter(Boolean)
    .map((line) => {
      const comma = line.indexOf(',');
      if (comma < 0) return { literal: line };
      const family = line.slice(0, comma).trim();
      const given = line.slice(comma + 1).trim();
      return given ? { family, given } : { family };
    });
}

/** CSL-JSON of the fields, leaving out what was left empty. */
export function cslFromFields(f: SourceFields): Record<string, unknown> {
  const csl: Record<string, unknown> = { type: f.type || 'document', title: f.title.trim() };
  const author = namesFromLines(f.authors);
  if (author.length > 0) csl['author'] = author;
  const year = f.year.trim();
  if (/^\d{1,4}$/.test(year)) csl['issued'] = { 'date-parts': [[Number(year)]] };
  const text: [keyof SourceFields, string][] = [
    ['container', 'container-title'],
    ['volume', 'volume'],
    ['issue', 'issue'],
    ['pages', 'page'],
    ['publisher', 'publisher'],
    ['doi', 'DOI'],
    ['url', 'URL'],
  ];
  for (const [field, key] of text) {
    const value = f[field].trim();
    if (value) csl[key] = value;
  }
  return csl;
}
