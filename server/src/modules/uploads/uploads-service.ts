import {
  checkRows,
  FileProblem,
  readUpload,
  type CheckedUpload,
  type UploadRow,
} from '../../../../imports/proposal-upload';
import type { Database, Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import type {
  CreateProposalBody,
  ItemIssue,
  ItemWarning,
  ProposalItemInput,
} from '../proposals/proposals-schemas';
import type { Queryable } from '../releases/releases-repository';
import { entryToItem } from './upload-items';
import { uploadsRepository } from './uploads-repository';
import type { PreviewRow, UploadCreated, UploadPreview } from './uploads-schemas';

/** The proposals core as an upload uses it: the same checks and draft creation as the form. */
export interface ProposalsPort {
  checkItems(
    db: Queryable,
    items: readonly ProposalItemInput[],
  ): Promise<{ issues: ItemIssue[]; warnings: ItemWarning[] }>;
  createDraftIn(
    tx: Tx,
    actor: Express.User,
    input: CreateProposalBody,
  ): Promise<{ id: number; warnings: ItemWarning[] }>;
}

export interface UploadFile {
  readonly bytes: Uint8Array;
  readonly name: string;
}

// Item fields → the column a curator fixes (paths as `items[3].sourceId`).
const FIELD_COLUMN: Record<string, string> = {
  species: 'species',
  phase: 'phase',
  modification: 'modification',
  value: 'value',
  uncertainty: 'uncertainty',
  uncertaintyBasis: 'uncertainty_basis',
  sourceId: 'source',
  temperature: 'temperature_k',
  toPhase: 'to_phase',
  key: 'key',
  formula: 'formula',
  charge: 'charge',
  casRn: 'cas_rn',
  inchi: 'inchi',
  inchiKey: 'inchikey',
  ranges: 't_min_k',
};

function columnOf(path: string): string | undefined {
  const field = /^items\[\d+\]\.([A-Za-z]+)/.exec(path)?.[1];
  return field === undefined ? undefined : FIELD_COLUMN[field];
}

const unique = (values: (string | null | undefined)[]) => [
  ...new Set(values.filter((v): v is string => typeof v === 'string' && v !== '')),
];

function fileProblem(err: unknown): never {
  if (err instanceof FileProblem)
    throw new AppError(
      422,
      err.code,
      err.message,
      err.line === undefined ? {} : { line: err.line },
    );
  throw err;
}

export function createUploadsService(db: Database, proposals: ProposalsPort) {
  /** Reads and checks every row; nothing is written. */
  async function check(
    q: Queryable,
    file: UploadFile,
  ): Promise<
    Omit<UploadPreview, 'dryRun'> & {
      items: ProposalItemInput[];
    }
  > {
    const raw = (() => {
      try {
        return readUpload(file.bytes, file.name);
      } catch (err) {
        return fileProblem(err);
      }
    })();
    const keys = unique(raw.rows.flatMap((r) => [r.cells.species, r.cells.key]));
    // One after another: inside the submit's transaction they share one connection.
    const formulas = await uploadsRepository.speciesFormulas(q, keys);
    const sourceIds = await uploadsRepository.sourceIds(
      q,
      unique(raw.rows.map((r) => r.cells.source)),
    );
    const accepted = await uploadsRepository.acceptedQuantities(q, keys);
    const checked: CheckedUpload = checkRows(raw, {
      species: formulas,
      sources: new Set(sourceIds.keys()),
    });

    const items = checked.entries.map((e) => entryToItem(e, { sourceIds, accepted }));
    const itemOf = new Map<UploadRow, number>();
    checked.entries.forEach((e, i) => e.rows.forEach((r) => itemOf.set(r, i)));
    const onItem = (index: number, problem: { code: string; message: string; path?: string }) => {
      const column = problem.path === undefined ? undefined : columnOf(problem.path);
      for (const row of checked.entries[index]?.rows ?? [])
        row.errors.push({
          code: problem.code,
          message: problem.message,
          ...(column === undefined ? {} : { column }),
        });
    };
    // The proposals core checks each item's shape and its registry facts, as for the form.
    const { issues, warnings } =
      items.length > 0 ? await proposals.checkItems(q, items) : { issues: [], warnings: [] };
    for (const issue of issues) onItem(issue.index, issue);
    const rows: PreviewRow[] = checked.rows.map((r) => {
      const index = itemOf.get(r);
      const first = index !== undefined && checked.entries[index]?.rows[0] === r;
      return {
        n: r.n,
        line: r.line,
        layout: r.layout,
        cells: r.cells,
        itemIndex: r.errors.length === 0 && index !== undefined ? index : null,
        item: first && r.errors.length === 0 ? (items[index] as Record<string, unknown>) : null,
        errors: r.errors,
      };
    });
    const errorRowCount = rows.filter((r) => r.errors.length > 0).length;
    return {
      ok: errorRowCount === 0 && checked.fileErrors.length === 0 && rows.length > 0,
      fileName: file.name,
      format: checked.format,
      layouts: unique(checked.rows.map((r) => r.layout)) as UploadPreview['layouts'],
      rationale: checked.rationale,
      rowCount: rows.length,
      itemCount: items.length,
      errorRowCount,
      fileErrors:
        rows.length === 0 && checked.fileErrors.length === 0
          ? [{ message: 'The file has a header but no rows.' }]
          : checked.fileErrors,
      rows,
      // Shown in the dry run too (the form shows them as you type): named by the item's line.
      warnings: warnings.map((w) => {
        const line = checked.entries[w.index]?.rows[0]?.line;
        return line === undefined ? w : { ...w, message: `Line ${line}: ${w.message}` };
      }),
      items,
    };
  }

  return {
    async preview(file: UploadFile): Promise<UploadPreview> {
      const { items: _items, ...preview } = await check(db, file);
      return { dryRun: true, ...preview };
    },

    /** All rows or none: one draft proposal in one transaction, or 422 with the rows at fault. */
    async submit(
      actor: Express.User,
      file: UploadFile,
      rationale?: string,
    ): Promise<UploadCreated> {
      return db.transaction(async (tx) => {
        const { items, ...preview } = await check(tx, file);
        if (!preview.ok) {
          const bad = preview.rows.filter((r) => r.errors.length > 0);
          throw new AppError(
            422,
            'invalid_rows',
            preview.fileErrors.length > 0
              ? `The file cannot be imported: ${preview.fileErrors[0]!.message} Nothing was saved.`
              : `${bad.length} of ${preview.rowCount} rows have errors; nothing was saved. Fix them and upload the file again.`,
            { dryRun: false, ...preview, rows: bad },
          );
        }
        const created = await proposals.createDraftIn(tx, actor, {
          rationale:
            rationale ||
            preview.rationale ||
            `Bulk upload of ${file.name} (${preview.rowCount} rows)`,
          items,
        });
        return {
          id: created.id,
          status: 'draft',
          itemCount: items.length,
          rowCount: preview.rowCount,
          warnings: created.warnings,
        };
      });
    },
  };
}

export type UploadsService = ReturnType<typeof createUploadsService>;
