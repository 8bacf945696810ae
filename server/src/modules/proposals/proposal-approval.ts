import type { ProposalItemRow, RevisionStatus } from '../../../../schema';
import { pgErrorCode, type Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { storedFormula } from './item-check';
import { proposalsRepository } from './proposals-repository';
import type { ProposalItemInput } from './proposals-schemas';
import { registryRepository } from './registry-repository';

/** Why a proposal cannot be decided as submitted: the registry moved on since. */
export interface StaleReason {
  item: number;
  /** The revision the item targeted (or the input a derived value used). */
  revisionId: number | null;
  status: RevisionStatus | 'accepted';
  supersededBy: number | null;
  reason: 'target_superseded' | 'target_retired' | 'value_added' | 'input_superseded';
  message: string;
}

const describe = (i: ProposalItemRow) =>
  `${i.speciesKey} (${i.phase}${i.modification ? `,${i.modification}` : ''}) ${i.quantity}`;

/**
 * Locks the revisions the items target (in id order) and reports every item whose target is no
 * longer the accepted value, every new value that meets one accepted since, and every derived
 * value whose inputs were superseded. Called under the proposal's row lock.
 */
export async function staleReasons(tx: Tx, items: ProposalItemRow[]): Promise<StaleReason[]> {
  const out: StaleReason[] = [];
  const targets = items.filter((i) => i.targetRevisionId !== null);
  const locked = new Map(
    (
      await registryRepository.lockRevisions(
        tx,
        targets.map((i) => i.targetRevisionId!),
      )
    ).map((r) => [r.id, r.status]),
  );
  for (const i of targets) {
    const status = locked.get(i.targetRevisionId!);
    if (status === 'accepted') continue;
    const by = await registryRepository.supersederOf(tx, i.targetRevisionId!);
    out.push({
      item: i.seq,
      revisionId: i.targetRevisionId,
      status: status ?? 'retired',
      supersededBy: by,
      reason: status === 'retired' ? 'target_retired' : 'target_superseded',
      message:
        status === 'retired'
          ? `item ${i.seq + 1}: revision ${i.targetRevisionId} of ${describe(i)} was retired since submission`
          : `item ${i.seq + 1}: revision ${i.targetRevisionId} of ${describe(i)} was superseded by revision ${by} since submission`,
    });
  }
  for (const i of items) {
    const newValue =
      i.targetRevisionId === null &&
      (i.kind === 'add_value' || i.kind === 'derive_value') &&
      i.speciesKey !== null;
    if (newValue) {
      const speciesId = await registryRepository.speciesIdByKey(tx, i.speciesKey!);
      if (speciesId !== null) {
        const accepted = await acceptedNow(tx, speciesId, i);
        if (accepted !== null)
          out.push({
            item: i.seq,
            revisionId: accepted,
            status: 'accepted',
            supersededBy: null,
            reason: 'value_added',
            message: `item ${i.seq + 1}: ${describe(i)} gained an accepted value (revision ${accepted}) since submission`,
          });
      }
    }
    if (i.kind === 'derive_value') {
      for (const s of await registryRepository.staleOfInputs(tx, i.inputRevisionIds)) {
        out.push({
          item: i.seq,
          revisionId: s.inputRevisionId,
          status: 'superseded',
          supersededBy: s.supersededBy,
          reason: 'input_superseded',
          message: `item ${i.seq + 1}: input revision ${s.inputRevisionId} (${s.species}, ${s.phase}) was ${s.supersededBy ? `superseded by revision ${s.supersededBy}` : 'retired'}: re-derive it`,
        });
      }
    }
  }
  return out;
}

const acceptedNow = (tx: Tx, speciesId: number, i: ProposalItemRow) =>
  registryRepository.acceptedOf(tx, speciesId, i.phase!, i.modification, i.quantity!);

export const staleError = (reasons: StaleReason[]) =>
  new AppError(
    409,
    'stale',
    `The registry changed since this proposal was submitted: ${reasons.map((r) => r.message).join('; ')}`,
    { stale: reasons },
  );

/**
 * Applies an approved proposal's items in order, inside the decision's transaction: new species
 * and phases, accepted revisions (which wait for the next release), superseded and retired
 * targets. Value columns of existing revisions are never touched, only their status. Returns the
 * revisions created, by item.
 */
export async function applyItems(
  tx: Tx,
  items: ProposalItemRow[],
  authorId: number,
): Promise<number[]> {
  const created: number[] = [];
  for (const item of items) {
    const input = item.input as ProposalItemInput;
    if (input.kind === 'add_species') {
      const speciesId = await registryRepository.insertSpecies(tx, {
        key: input.key,
        name: input.name,
        synonyms: input.synonyms,
        formula: storedFormula(input),
        charge: input.charge,
        casRn: input.casRn ?? null,
        inchi: input.inchi ?? null,
        inchiKey: input.inchiKey ?? null,
        smiles: input.smiles ?? null,
        notes: input.notes ?? null,
        createdBy: authorId,
      });
      for (const p of input.phases)
        await registryRepository.ensurePhase(tx, speciesId, p.phase, p.modification ?? null);
      continue;
    }
    const speciesId = await registryRepository.speciesIdByKey(tx, item.speciesKey!);
    if (speciesId === null)
      throw new AppError(409, 'stale', `Species ${item.speciesKey} no longer exists`);
    const phase = await registryRepository.ensurePhase(
      tx,
      speciesId,
      item.phase!,
      item.modification,
    );
    if (input.kind === 'add_phase') continue;
    if (item.targetRevisionId !== null) {
      await registryRepository.setStatus(
        tx,
        item.targetRevisionId,
        input.kind === 'retire_value' ? 'retired' : 'superseded',
      );
    }
    if (input.kind === 'retire_value') continue;

    const common = {
      speciesPhaseId: phase.id,
      quantity: item.quantity!,
      sourceId: item.sourceId!,
      standardPressure: input.standardPressure,
      notes: input.notes ?? null,
      status: 'accepted' as const,
      supersedesId: item.targetRevisionId,
      createdBy: authorId,
    };
    let revisionId: number;
    if (input.kind === 'derive_value') {
      const d = item.derivation!;
      revisionId = await registryRepository.insertRevision(tx, {
        ...common,
        kind: 'formation_enthalpy',
        value: item.value,
        uncertainty: item.uncertainty,
        uncertaintyBasis:
          item.uncertainty === null ? null : (d.valueUncertaintyBasis ?? 'as_stated'),
        method: 'derived',
        derivation: {
          equation: d.equation,
          deltaH: d.deltaH,
          uncertainty: d.uncertainty,
          releaseVersion: d.releaseVersion,
          uncertaintyBasis: d.uncertaintyBasis ?? null,
        },
      });
      await registryRepository.insertInputs(tx, revisionId, item.inputRevisionIds);
    } else if (input.quantity === 'heat_capacity') {
      revisionId = await registryRepository.insertRevision(tx, {
        ...common,
        kind: 'heat_capacity',
        heatCapacityForm: input.form,
        method: input.method ?? null,
        fromMemory: input.fromMemory,
      });
      await registryRepository.insertRanges(
        tx,
        input.ranges.map((r, seq) => ({
          revisionId,
          seq,
          tMin: String(r.tMin),
          tMax: String(r.tMax),
          coefficients: r.coefficients.map((c) => (c === null ? null : String(c))) as string[],
        })),
      );
    } else {
      revisionId = await registryRepository.insertRevision(tx, {
        ...common,
        kind: input.quantity === 'transition' ? 'transition' : 'formation_enthalpy',
        value: item.value,
        uncertainty: item.uncertainty,
        uncertaintyBasis:
          item.uncertainty === null ? null : (input.uncertaintyBasis ?? 'as_stated'),
        method: input.method,
        fromMemory: input.fromMemory,
        ...(input.quantity === 'transition'
          ? {
              temperature: String(input.temperature),
              toPhase: input.toPhase,
              toModification: input.toModification ?? null,
            }
          : {}),
      });
    }
    created.push(revisionId);
    await proposalsRepository.setItem(tx, item.id, { createdRevisionId: revisionId });
  }
  return created;
}

/** A unique index that refused an approval: a concurrent change got there first. */
export function conflictOf(err: unknown): unknown {
  if (pgErrorCode(err) !== '23505') return err;
  const constraint = (err as { cause?: { constraint?: string } }).cause?.constraint ?? '';
  if (constraint === 'revisions_one_accepted_idx')
    return new AppError(
      409,
      'stale',
      'Another value of the same species-phase was accepted meanwhile',
      { constraint },
    );
  return new AppError(
    409,
    'duplicate_species',
    'A species with the same key, CAS RN or InChIKey exists already',
    { constraint },
  );
}
