import type { UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import type { ReleaseSnapshot } from '../releases/release-snapshot';
import { usersRepository } from '../users/users-repository';
import { snapshotSource } from './derivation';
import { checkAndResolve } from './item-check';
import { proposalsRepository } from './proposals-repository';
import type { CreateAnswer, CreateProposalBody, ItemIssue, ItemWarning } from './proposals-schemas';

/**
 * Drafts, for the proposals service and for other modules (bulk upload):
 * - `checkItems(dbOrTx, items)` validates raw items (zod shape, then the registry: species,
 *   phases, sources, formulas, identifiers, targets, derivations) without saving and returns
 *   `issues` (`{index, path, code, message}`, path like `items[3].casRn`; none = valid) and
 *   `warnings` (likely duplicate species, never blocking).
 * - `createDraftIn(tx, actor, {rationale, items})` creates a draft proposal with its audit row
 *   inside the caller's transaction; throws 422 `invalid_items` (details.issues) when any item
 *   fails, 403 when the actor is no longer a curator. Returns `{id, status: 'draft', warnings}`.
 */

type Actor = Pick<UserRow, 'id'>;
type Queryable = Database | Tx;

export interface ItemCheckOptions {
  /** Published snapshots (the releases service's cache); loaded directly when absent. */
  published?: (version: string) => Promise<ReleaseSnapshot>;
}

export async function checkItems(
  db: Queryable,
  items: readonly unknown[],
  options: ItemCheckOptions = {},
): Promise<{ issues: ItemIssue[]; warnings: ItemWarning[] }> {
  const { issues, warnings } = await checkAndResolve(
    db,
    items,
    snapshotSource(db, options.published),
  );
  return { issues, warnings };
}

export const invalidItems = (issues: ItemIssue[]) =>
  new AppError(
    422,
    'invalid_items',
    `${issues.length} problem${issues.length === 1 ? '' : 's'} in the items: ${issues
      .slice(0, 3)
      .map((i) => `${i.path}: ${i.message}`)
      .join('; ')}`,
    { issues },
  );

export async function createDraftIn(
  tx: Tx,
  actor: Actor,
  input: CreateProposalBody,
  options: ItemCheckOptions = {},
): Promise<CreateAnswer> {
  await usersRepository.assertActorRoleLocked(tx, actor.id, 'curator');
  const checked = await checkAndResolve(tx, input.items, snapshotSource(tx, options.published));
  if (checked.issues.length) throw invalidItems(checked.issues);
  const row = await proposalsRepository.insertProposal(tx, actor.id, input.rationale);
  await proposalsRepository.insertItems(tx, row.id, checked.items);
  await recordAudit(tx, {
    actorId: actor.id,
    action: 'proposal.created',
    entityType: 'proposal',
    entityId: row.id,
    after: { status: 'draft', rationale: input.rationale, items: checked.items.length },
  });
  return { id: row.id, status: 'draft', warnings: checked.warnings };
}
