import type { Layout } from './layouts';
import type { UploadFormat } from './upload-text';

/** The row limit of one upload (data rows, not counting the header). */
export const MAX_UPLOAD_ROWS = 20_000;

/** What is wrong with one row; `column` names the CSV column (XML attribute) when known. */
export interface RowProblem {
  readonly code: string;
  readonly message: string;
  readonly column?: string;
}

/** A problem of the whole file that still lets its rows be shown (a missing column, say). */
export interface FileError {
  readonly line?: number;
  readonly column?: string;
  readonly message: string;
}

/** One data row as read: its place, its layout and its cells by column (empty → null). */
export interface UploadRow {
  /** Position among the upload's rows, from 1. */
  readonly n: number;
  /** Line in the uploaded file where the row (element) starts or, for CSV, ends. */
  readonly line: number;
  readonly layout: Layout;
  readonly cells: Readonly<Record<string, string | null>>;
  readonly errors: RowProblem[];
}

/** An upload read into rows, before any check of their content. */
export interface RawUpload {
  readonly format: UploadFormat;
  /** XML `<rationale>`; CSV uploads have none. */
  readonly rationale: string | null;
  readonly rows: UploadRow[];
  readonly fileErrors: FileError[];
  /** CSV: the text the registry parser reads as it is, so its line numbers are the file's. */
  readonly csvText?: string;
}
