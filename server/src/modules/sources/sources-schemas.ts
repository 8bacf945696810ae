import { z } from 'zod';
import { INT4_MAX, intText, positiveIntText } from '../../middleware/validate';

/** Largest BibTeX or RIS text accepted: one entry is a few kilobytes. */
const MAX_TEXT = 100_000;

/** A CSL name: family and given, or one literal name (an organisation). */
const CslName = z
  .object({ family: z.string(), given: z.string(), literal: z.string(), suffix: z.string() })
  .partial()
  .catchall(z.unknown())
  .refine((n) => Boolean(n.family || n.literal), 'a name needs "family" or "literal"');

/** CSL-JSON as given by hand: the fields a citation is built from are checked, the rest kept. */
export const CslInput = z
  .object({
    type: z.string().min(1).max(50).optional(),
    title: z.string().trim().min(1).max(2000),
    author: z.array(CslName).max(500).optional(),
    editor: z.array(CslName).max(500).optional(),
    issued: z
      .object({ 'date-parts': z.array(z.array(z.union([z.number().int(), z.string()])).max(3)) })
      .catchall(z.unknown())
      .optional(),
    DOI: z.string().max(300).optional(),
  })
  .catchall(z.unknown());

/** `POST /sources`: exactly one of a BibTeX entry, a RIS record, a DOI or a CSL-JSON item. */
export const CreateSourceBody = z
  .object({
    bibtex: z.string().min(1).max(MAX_TEXT).optional(),
    ris: z.string().min(1).max(MAX_TEXT).optional(),
    doi: z.string().min(1).max(300).optional(),
    csl: CslInput.optional(),
  })
  .strict()
  .refine((b) => Object.values(b).filter((v) => v !== undefined).length === 1, {
    message: 'send exactly one of bibtex, ris, doi or csl',
  });
export type CreateSourceBody = z.infer<typeof CreateSourceBody>;

/** A source as the API names it: its id as text, the formatted citation and its DOI. */
export const SourceAnswer = z.object({
  id: z.string(),
  citation: z.string(),
  doi: z.string().nullable(),
});
export type SourceAnswer = z.infer<typeof SourceAnswer>;

export const SourceDetail = SourceAnswer.extend({
  /** CSL-JSON: the citation's fields (title, author, issued, container-title, …). */
  csl: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type SourceDetail = z.infer<typeof SourceDetail>;

export const SourceListQuery = z.object({
  q: z.string().trim().max(200).optional(),
  limit: intText(1, 100).default(20),
  offset: intText(0, 1_000_000).default(0),
});

export const SourceList = z.object({
  items: z.array(SourceAnswer),
  total: z.number().int(),
});
export type SourceList = z.infer<typeof SourceList>;

/** `:id` and, for `/sources/:id.bib` and `.ris`, the same id before the extension. */
export const SourceParams = z.object({ id: positiveIntText(INT4_MAX) });
export const DocumentParams = z.object({
  id: positiveIntText(INT4_MAX),
  docId: positiveIntText(INT4_MAX),
});

export const DocumentView = z.object({
  id: z.string(),
  sourceId: z.string(),
  fileName: z.string(),
  size: z.number().int(),
  sha256: z.string(),
  uploadedAt: z.string(),
  uploadedBy: z.object({ login: z.string(), name: z.string() }),
});
export type DocumentView = z.infer<typeof DocumentView>;

export const DocumentList = z.object({ documents: z.array(DocumentView) });
export type DocumentList = z.infer<typeof DocumentList>;
