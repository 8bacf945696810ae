import { parse } from 'csv-parse/sync';
import { describeLayouts, layoutOfHeader } from './layouts';
import { MAX_UPLOAD_ROWS, type RawUpload, type UploadRow } from './upload-rows';
import { FileProblem } from './upload-text';

/**
 * A CSV upload: one file of the registry's format, its layout told by its header. Cells are
 * read here only to show them; the registry parser checks them (with the same csv-parse options,
 * so both agree on line numbers).
 */
export function readCsvUpload(text: string): RawUpload {
  let raw: { record: string[]; info: { lines: number } }[];
  try {
    raw = parse(text, {
      info: true,
      relax_column_count: true,
      skip_empty_lines: true,
      trim: true,
    }) as unknown as typeof raw;
  } catch (err) {
    const line = (err as { lines?: number }).lines;
    throw new FileProblem('csv_syntax', `CSV syntax: ${(err as Error).message}`, line);
  }
  const [head, ...body] = raw;
  if (head === undefined) throw new FileProblem('empty_file', 'The file is empty.');
  const header = head.record;
  const layout = layoutOfHeader(header);
  if (layout === null)
    throw new FileProblem(
      'unknown_layout',
      `The header row (${header.join(',').slice(0, 200)}) matches none of the upload layouts: ${describeLayouts()}.`,
      1,
    );
  if (body.length > MAX_UPLOAD_ROWS)
    throw new FileProblem(
      'too_many_rows',
      `The file has ${body.length} rows; an upload takes at most ${MAX_UPLOAD_ROWS}. Split it into several files.`,
    );
  const rows: UploadRow[] = body.map(({ record, info }, i) => {
    const cells: Record<string, string | null> = {};
    header.forEach((name, c) => {
      const cell = record[c];
      cells[name] = cell === undefined || cell === '' ? null : cell;
    });
    return { n: i + 1, line: info.lines, layout, cells, errors: [] };
  });
  return { format: 'csv', rationale: null, rows, fileErrors: [], csvText: text };
}
