/**
 * Formats a CSL-JSON item as one plain-text citation in the registry's own compact style:
 *   Authors (Year). Title. Container Volume, Pages. Publisher. https://doi.org/DOI
 * Authors: up to four as "Family, G."; more become "First, G. et al.". Missing parts are left
 * out rather than guessed.
 */
export interface CslName {
  family?: string;
  given?: string;
  literal?: string;
}

export interface CslLike {
  title?: unknown;
  author?: unknown;
  editor?: unknown;
  issued?: unknown;
  'container-title'?: unknown;
  volume?: unknown;
  issue?: unknown;
  page?: unknown;
  publisher?: unknown;
  edition?: unknown;
  DOI?: unknown;
  [field: string]: unknown;
}

const MAX_AUTHORS = 4;

const text = (v: unknown): string | null =>
  typeof v === 'string' && v.trim() !== '' ? v.trim() : typeof v === 'number' ? String(v) : null;

/** "Marie Anne" → "M. A."; "M. W., Jr." keeps the suffix: "M. W., Jr." */
function initials(given: string): string {
  const [first, ...suffix] = given.split(',');
  const letters = first!
    .split(/[\s.]+/)
    .filter((p) => /^\p{L}/u.test(p))
    .map((part) =>
      part
        .split('-')
        .filter(Boolean)
        .map((p) => `${p[0]!.toUpperCase()}.`)
        .join('-'),
    )
    .join(' ');
  const tail = suffix.join(',').trim();
  return tail ? `${letters}, ${tail}` : letters;
}

function personName(n: CslName): string | null {
  const literal = text(n.literal);
  if (literal) return literal;
  const family = text(n.family);
  if (!family) return null;
  const given = text(n.given);
  return given ? `${family}, ${initials(given)}` : family;
}

function names(list: unknown): string | null {
  if (!Array.isArray(list)) return null;
  const all = list
    .map((n) => (n && typeof n === 'object' ? personName(n as CslName) : null))
    .filter((n): n is string => n !== null);
  if (all.length === 0) return null;
  if (all.length > MAX_AUTHORS) return `${all[0]} et al.`;
  return all.join('; ');
}

function year(issued: unknown): string | null {
  const parts = (issued as { 'date-parts'?: unknown[][] } | null)?.['date-parts'];
  if (!Array.isArray(parts) || !Array.isArray(parts[0])) return null;
  return text(parts[0][0]);
}

const ending = (s: string) => (/[.!?]$/.test(s) ? s : `${s}.`);

function ordinal(n: number): string {
  const teen = n % 100 >= 11 && n % 100 <= 13;
  const suffix = teen ? 'th' : (['th', 'st', 'nd', 'rd'][n % 10] ?? 'th');
  return `${n}${suffix}`;
}

export function formatCitation(csl: CslLike): string {
  const out: string[] = [];
  const authors = names(csl.author);
  const editors = authors ? null : names(csl.editor);
  const who = authors ?? (editors ? `${editors} (ed.)` : null);
  const y = year(csl.issued);
  if (who) out.push(y ? `${who} (${y}).` : ending(who));
  else if (y) out.push(`(${y}).`);
  const title = text(csl.title);
  if (title) out.push(ending(title));
  const container = text(csl['container-title']);
  if (container) {
    let c = container;
    const volume = text(csl.volume);
    const issue = text(csl.issue);
    const page = text(csl.page);
    if (volume) c += ` ${volume}${issue ? `(${issue})` : ''}`;
    if (page) c += `, ${page}`;
    out.push(ending(c));
  }
  const edition = text(csl.edition);
  if (edition)
    out.push(ending(/^\d+$/.test(edition) ? `${ordinal(Number(edition))} edition` : edition));
  const publisher = text(csl.publisher);
  if (publisher) out.push(ending(publisher));
  const doi = text(csl.DOI);
  if (doi) out.push(`https://doi.org/${doi.toLowerCase()}`);
  return out.join(' ') || 'Untitled source';
}
