/**
 * First look at an uploaded file: is it text at all, UTF-8, CSV or XML? Every refusal is a
 * FileProblem with a code and a sentence a curator can act on; nothing here throws otherwise.
 */
export type UploadFormat = 'csv' | 'xml';

export type FileProblemCode =
  | 'empty_file'
  | 'binary_file'
  | 'not_utf8'
  | 'unknown_layout'
  | 'too_many_rows'
  | 'xml_doctype'
  | 'xml_syntax'
  | 'csv_syntax';

/** A reason the file as a whole cannot be read into rows. */
export class FileProblem extends Error {
  constructor(
    readonly code: FileProblemCode,
    message: string,
    readonly line?: number,
  ) {
    super(message);
    this.name = 'FileProblem';
  }
}

const BINARY_SIGNATURES: readonly [number[], string][] = [
  [[0x50, 0x4b, 0x03, 0x04], 'a ZIP archive or a spreadsheet workbook (.xlsx, .ods)'],
  [[0xd0, 0xcf, 0x11, 0xe0], 'an old-style Office document (.xls)'],
  [[0x25, 0x50, 0x44, 0x46], 'a PDF document'],
  [[0x1f, 0x8b], 'a gzip archive'],
  [[0x89, 0x50, 0x4e, 0x47], 'a PNG image'],
  [[0xff, 0xd8, 0xff], 'a JPEG image'],
];

const startsWith = (bytes: Uint8Array, sig: readonly number[]) =>
  sig.every((b, i) => bytes[i] === b);

/** Line (from 1) of a byte offset. */
function lineAt(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < bytes.length; i++) if (bytes[i] === 0x0a) line++;
  return line;
}

/** Decodes an upload as UTF-8 text (a byte-order mark is dropped) or throws a FileProblem. */
export function decodeUpload(bytes: Uint8Array): string {
  if (
    bytes.length === 0 ||
    bytes.every((b) => b === 0x20 || b === 0x0a || b === 0x0d || b === 0x09)
  )
    throw new FileProblem('empty_file', 'The file is empty: it holds no header and no rows.');
  if (startsWith(bytes, [0xff, 0xfe]) || startsWith(bytes, [0xfe, 0xff]))
    throw new FileProblem(
      'not_utf8',
      'The file is saved as UTF-16; save it as UTF-8 ("CSV UTF-8" in most spreadsheets) and upload it again.',
    );
  for (const [sig, what] of BINARY_SIGNATURES)
    if (startsWith(bytes, sig))
      throw new FileProblem(
        'binary_file',
        `This is ${what}, not a text file. Save the sheet as CSV (UTF-8) or XML and upload that.`,
      );
  const nul = bytes.subarray(0, 65_536).indexOf(0);
  if (nul >= 0)
    throw new FileProblem(
      'binary_file',
      `The file holds binary data (a NUL byte on line ${lineAt(bytes, nul)}); upload a CSV or XML text file.`,
      lineAt(bytes, nul),
    );
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
  } catch {
    const lenient = new TextDecoder('utf-8').decode(bytes);
    const bad = lenient.indexOf('\uFFFD');
    const line = lenient.slice(0, Math.max(bad, 0)).split('\n').length;
    throw new FileProblem(
      'not_utf8',
      `Line ${line} is not valid UTF-8 (the file may be saved as Latin-1 or Windows-1252); save it as UTF-8 and upload it again.`,
      line,
    );
  }
}

/** XML when the text opens with `<` (no CSV header does) or the name ends in .xml; else CSV. */
export function detectFormat(text: string, fileName = ''): UploadFormat {
  return text.trimStart().startsWith('<') || /\.xml$/i.test(fileName) ? 'xml' : 'csv';
}
