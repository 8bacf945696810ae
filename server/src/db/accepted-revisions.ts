import { and, eq, sql } from 'drizzle-orm';
import {
  revisionInputs,
  revisions,
  type DerivationRecord,
  type RevisionRow,
} from '../../../schema';
import type { Tx } from './client';

/** A value accepted outside the review workflow: demo data and tests. */
export interface AcceptedValue {
  speciesPhaseId: number;
  /** J/mol, exact decimal text. */
  value: string;
  uncertainty?: string | null;
  uncertaintyBasis?: 'standard' | 'expanded_k2' | 'as_stated' | null;
  method: string;
  sourceId: number;
  notes?: string | null;
  createdBy: number | null;
  /** For a derived value: what it was computed from. */
  derivation?: DerivationRecord;
  inputRevisionIds?: number[];
}

/**
 * Accepts a formation enthalpy the way an approval does: the species-phase's accepted revision
 * (if any) becomes superseded and the new one, superseding it, becomes accepted and awaits the
 * next release.
 */
export async function acceptFormationValueIn(tx: Tx, v: AcceptedValue): Promise<RevisionRow> {
  const current = and(
    eq(revisions.speciesPhaseId, v.speciesPhaseId),
    eq(revisions.quantity, 'formation_enthalpy'),
    eq(revisions.status, 'accepted'),
  );
  const [old] = await tx
    .update(revisions)
    .set({ status: 'superseded', statusChangedAt: sql`now()` })
    .where(current)
    .returning({ id: revisions.id });
  const [row] = await tx
    .insert(revisions)
    .values({
      speciesPhaseId: v.speciesPhaseId,
      kind: 'formation_enthalpy',
      quantity: 'formation_enthalpy',
      value: v.value,
      uncertainty: v.uncertainty ?? null,
      uncertaintyBasis: v.uncertainty ? (v.uncertaintyBasis ?? 'standard') : null,
      method: v.method,
      sourceId: v.sourceId,
      notes: v.notes ?? null,
      status: 'accepted',
      supersedesId: old?.id ?? null,
      derivation: v.derivation ?? null,
      createdBy: v.createdBy,
    })
    .returning();
  if (v.inputRevisionIds?.length) {
    await tx
      .insert(revisionInputs)
      .values(
        v.inputRevisionIds.map((inputRevisionId) => ({ revisionId: row!.id, inputRevisionId })),
      );
  }
  return row!;
}

/** Withdraws an accepted value without replacement: the next release leaves it out. */
export async function retireRevisionIn(tx: Tx, revisionId: number): Promise<void> {
  await tx
    .update(revisions)
    .set({ status: 'retired', statusChangedAt: sql`now()` })
    .where(and(eq(revisions.id, revisionId), eq(revisions.status, 'accepted')));
}
