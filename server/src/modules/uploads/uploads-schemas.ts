import { z } from 'zod';
import { ItemWarning } from '../proposals/proposals-schemas';

/**
 * The contract of the bulk-upload route (issue 7): `POST /api/v1/proposals/uploads?dryRun=`,
 * multipart with one file in the field `file` (and an optional `rationale`). The file format is
 * imports/README.md's "Proposal upload". The client imports the inferred types only.
 */

/** Largest file accepted (bytes); larger ones are refused with 413 before they are read. */
export const UPLOAD_MAX_BYTES = 10 * 1024 * 1024;

export const UploadQuery = z
  .object({
    /** `true` (the default) checks and previews; `false` saves one draft proposal. */
    dryRun: z
      .enum(['true', 'false'])
      .default('true')
      .transform((v) => v === 'true'),
  })
  .strict();

export const UploadFields = z
  .object({
    /** Why the proposal is made; defaults to the XML `<rationale>` or a line naming the file. */
    rationale: z.string().trim().max(10_000).optional(),
  })
  .passthrough();

export const UploadLayout = z.enum(['species', 'formation', 'heat_capacity', 'transition']);

export const RowProblemView = z.object({
  code: z.string(),
  message: z.string(),
  /** The CSV column (XML attribute) at fault, when one is. */
  column: z.string().optional(),
});
export type RowProblemView = z.infer<typeof RowProblemView>;

export const FileErrorView = z.object({
  line: z.number().int().optional(),
  column: z.string().optional(),
  message: z.string(),
});

export const PreviewRow = z.object({
  /** Position among the file's rows, from 1. */
  n: z.number().int(),
  /** Line in the file. */
  line: z.number().int(),
  layout: UploadLayout,
  cells: z.record(z.string(), z.string().nullable()),
  /** Index of the proposal item this row becomes (a heat-capacity set spans rows); null with errors. */
  itemIndex: z.number().int().nullable(),
  /** The proposal item as POST /api/v1/proposals would take it (the first row of a set carries it). */
  item: z.record(z.string(), z.unknown()).nullable(),
  errors: z.array(RowProblemView),
});
export type PreviewRow = z.infer<typeof PreviewRow>;

export const UploadPreview = z.object({
  dryRun: z.boolean(),
  /** True when every row is clean and the file may be submitted. */
  ok: z.boolean(),
  fileName: z.string(),
  format: z.enum(['csv', 'xml']),
  layouts: z.array(UploadLayout),
  rationale: z.string().nullable(),
  rowCount: z.number().int(),
  itemCount: z.number().int(),
  errorRowCount: z.number().int(),
  fileErrors: z.array(FileErrorView),
  rows: z.array(PreviewRow),
  /** Likely duplicate species and similar: shown, never blocking. */
  warnings: z.array(ItemWarning),
});
export type UploadPreview = z.infer<typeof UploadPreview>;

/** 201 of a submitted upload: the draft proposal holding every row. */
export const UploadCreated = z.object({
  id: z.number().int(),
  status: z.literal('draft'),
  itemCount: z.number().int(),
  rowCount: z.number().int(),
  warnings: z.array(ItemWarning),
});
export type UploadCreated = z.infer<typeof UploadCreated>;
