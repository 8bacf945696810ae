import { z } from 'zod';
import { decodeUtf8, type ParseResult, type RowError, type TextInput } from './csv-table';
import type { CslItem } from './row-types';

const FILE = 'sources.json';

/** Source keys look like species keys: `codata-1989`, `nbs-tables-1982`. */
const SOURCE_ID = /^[a-z0-9]+(-[a-z0-9]+)*$/;

const name = z
  .object({
    family: z.string().optional(),
    given: z.string().optional(),
    literal: z.string().optional(),
  })
  .passthrough()
  .refine(
    (n) => n.family !== undefined || n.literal !== undefined,
    'a name needs family or literal',
  );

const item = z
  .object({
    id: z.string().regex(SOURCE_ID, 'lowercase words with hyphens, e.g. codata-1989'),
    type: z.string().min(1),
    title: z.string().min(1),
    author: z.array(name).optional(),
    editor: z.array(name).optional(),
    issued: z
      .object({ 'date-parts': z.array(z.array(z.union([z.number().int(), z.string()])).min(1)) })
      .passthrough()
      .optional(),
    publisher: z.string().optional(),
    'container-title': z.string().optional(),
    volume: z.string().optional(),
    page: z.string().optional(),
    DOI: z
      .string()
      .regex(/^10\.\d{4,9}\/\S+$/, 'a bare DOI such as 10.1063/1.555845 (no https://doi.org/)')
      .optional(),
    note: z.string().optional(),
  })
  .passthrough();

/** Line where each element of the top-level array starts (the text is valid JSON by now). */
function itemLines(text: string): number[] {
  const lines: number[] = [];
  let line = 1;
  let depth = 0;
  let inString = false;
  let expectItem = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i] as string;
    if (c === '\n') line++;
    if (inString) {
      if (c === '\\') i++;
      else if (c === '"') inString = false;
      continue;
    }
    if (/\s/.test(c)) continue;
    if (depth === 1 && expectItem) {
      lines.push(line);
      expectItem = false;
    }
    if (c === '"') inString = true;
    else if (c === '[' || c === '{') {
      depth++;
      if (depth === 1) expectItem = true;
    } else if (c === ']' || c === '}') depth--;
    else if (c === ',' && depth === 1) expectItem = true;
  }
  return lines;
}

export function parseSourcesJson(input: TextInput): ParseResult<CslItem> {
  const decoded = decodeUtf8(input, FILE);
  if ('error' in decoded) return { rows: [], errors: [decoded.error] };
  const text = decoded.text;
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (err) {
    return {
      rows: [],
      errors: [{ file: FILE, line: 1, message: `JSON: ${(err as Error).message}` }],
    };
  }
  if (!Array.isArray(data))
    return {
      rows: [],
      errors: [{ file: FILE, line: 1, message: 'expected an array of CSL-JSON items' }],
    };
  const rows: CslItem[] = [];
  const errors: RowError[] = [];
  const ids = new Map<string, number>();
  const dois = new Map<string, number>();
  const lines = itemLines(text);
  data.forEach((raw: unknown, index) => {
    const line = lines[index] ?? 1;
    const result = item.safeParse(raw);
    if (!result.success) {
      for (const issue of result.error.issues)
        errors.push({
          file: FILE,
          line,
          column: issue.path.join('.') || undefined,
          message: issue.message,
        });
      return;
    }
    const csl = result.data as CslItem;
    const before = errors.length;
    const earlier = ids.get(csl.id);
    if (earlier !== undefined)
      errors.push({
        file: FILE,
        line,
        column: 'id',
        message: `id ${csl.id} already on line ${earlier}`,
      });
    else ids.set(csl.id, line);
    if (csl.DOI !== undefined) {
      const doi = csl.DOI.toLowerCase();
      const first = dois.get(doi);
      if (first !== undefined)
        errors.push({
          file: FILE,
          line,
          column: 'DOI',
          message: `DOI ${csl.DOI} already on line ${first}`,
        });
      else dois.set(doi, line);
    }
    if (errors.length === before) rows.push(csl);
  });
  return { rows, errors };
}
