import type { UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { AppError, notFound } from '../../lib/app-error';
import type { CreateAnswer, CreateProposalBody } from './proposals-schemas';
import { registryRepository } from './registry-repository';

type Actor = Pick<UserRow, 'id'>;
type CreateDraftIn = (tx: Tx, actor: Actor, input: CreateProposalBody) => Promise<CreateAnswer>;

/**
 * `POST /revisions/:id/rederive`: a new draft proposal that derives the same ΔfH° again from the
 * same measurement against the newest values (`accepted` by default). Its item supersedes the
 * derived revision when that is still the accepted value.
 */
export function createRederive(db: Database, createDraftIn: CreateDraftIn) {
  return (actor: Actor, revisionId: number, body: { release: string; rationale?: string }) =>
    db.transaction(async (tx) => {
      const rev = await registryRepository.derivedRevision(tx, revisionId);
      if (!rev) throw notFound(`Revision ${revisionId}`);
      const d = rev.derivation;
      if (!d)
        throw new AppError(409, 'not_derived', `Revision ${revisionId} is not a derived value`);
      const stale = await registryRepository.staleInputsOfRevisions(tx, [revisionId]);
      const why = stale.length
        ? stale
            .map(
              (s) =>
                `input revision ${s.inputRevisionId} (${s.species}, ${s.phase}) ${s.supersededBy ? `was superseded by revision ${s.supersededBy}` : 'was retired'}`,
            )
            .join('; ')
        : 'a fresh derivation against the newest values';
      return createDraftIn(tx, actor, {
        rationale:
          body.rationale ?? `Re-derive ΔfH° of ${rev.speciesKey} (revision ${revisionId}): ${why}.`,
        items: [
          {
            kind: 'derive_value',
            species: rev.speciesKey,
            phase: rev.modification ? `${rev.phase},${rev.modification}` : rev.phase,
            equation: d.equation,
            deltaH: Number(d.deltaH),
            unit: 'J/mol',
            uncertainty: d.uncertainty === null ? null : Number(d.uncertainty),
            uncertaintyBasis: d.uncertaintyBasis ?? (d.uncertainty === null ? null : 'as_stated'),
            release: body.release,
            sourceId: String(rev.sourceId),
            method: 'derived',
            standardPressure: rev.standardPressure,
          },
        ],
      });
    });
}
