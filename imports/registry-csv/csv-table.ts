import { parse } from 'csv-parse/sync';

/** A problem with one row (or the file) — reported, never thrown, so a file lists all of them. */
export interface RowError {
  readonly file: string;
  /** 1-based line in the file (the header is line 1). */
  readonly line: number;
  readonly column?: string;
  readonly message: string;
}

export interface ParseResult<T> {
  readonly rows: T[];
  readonly errors: RowError[];
}

/** One data row: its cells by column name (empty cells are null) and its line. */
export interface CsvRecord {
  readonly line: number;
  readonly cells: Readonly<Record<string, string | null>>;
}

/** Input as read from disk (bytes, checked to be UTF-8) or as text already decoded. */
export type TextInput = string | Uint8Array;

/**
 * Decodes UTF-8 strictly (a byte-order mark is dropped). On invalid bytes, reports the line of
 * the first one instead of silently substituting U+FFFD.
 */
export function decodeUtf8(input: TextInput, file: string): { text: string } | { error: RowError } {
  if (typeof input === 'string') return { text: input.replace(/^\uFEFF/, '') };
  try {
    const text = new TextDecoder('utf-8', { fatal: true }).decode(input);
    return { text: text.replace(/^\uFEFF/, '') };
  } catch {
    const lenient = new TextDecoder('utf-8').decode(input);
    const bad = lenient.indexOf('\uFFFD');
    const line = lenient.slice(0, Math.max(bad, 0)).split('\n').length;
    return { error: { file, line, message: 'the file is not valid UTF-8' } };
  }
}

/**
 * Reads a comma-separated file with a header row (RFC 4180 quoting). The header must hold
 * exactly `columns` (any order); rows with another cell count are reported and skipped.
 */
export function readCsv(
  input: TextInput,
  file: string,
  columns: readonly string[],
): { records: CsvRecord[]; errors: RowError[] } {
  const errors: RowError[] = [];
  const decoded = decodeUtf8(input, file);
  if ('error' in decoded) return { records: [], errors: [decoded.error] };
  let raw: { record: string[]; info: { lines: number } }[];
  try {
    raw = parse(decoded.text, {
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      trim: true,
    }) as unknown as { record: string[]; info: { lines: number } }[];
  } catch (err) {
    const line = (err as { lines?: number }).lines ?? 1;
    return {
      records: [],
      errors: [{ file, line, message: `CSV syntax: ${(err as Error).message}` }],
    };
  }
  const [head, ...body] = raw;
  if (head === undefined)
    return { records: [], errors: [{ file, line: 1, message: 'empty file' }] };
  const header = head.record;
  const missing = columns.filter((c) => !header.includes(c));
  const unknown = header.filter((c) => !columns.includes(c));
  const repeated = header.filter((c, i) => header.indexOf(c) !== i);
  for (const c of missing)
    errors.push({ file, line: 1, column: c, message: `missing column ${c}` });
  for (const c of unknown)
    errors.push({ file, line: 1, column: c, message: `unknown column ${c}` });
  for (const c of repeated)
    errors.push({ file, line: 1, column: c, message: `column ${c} repeated` });
  if (errors.length > 0) return { records: [], errors };
  const records: CsvRecord[] = [];
  for (const { record, info } of body) {
    if (record.length !== header.length) {
      errors.push({
        file,
        line: info.lines,
        message: `expected ${header.length} cells, found ${record.length}`,
      });
      continue;
    }
    const cells: Record<string, string | null> = {};
    header.forEach((name, i) => {
      const cell = record[i] as string;
      cells[name] = cell === '' ? null : cell;
    });
    records.push({ line: info.lines, cells });
  }
  return { records, errors };
}
