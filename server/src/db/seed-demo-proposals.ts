import { eq, inArray, sql } from 'drizzle-orm';
import { proposals, sources, users } from '../../../schema';
import { DEMO_ACCOUNTS } from '../fakes/demo-accounts';
import { recordAudit } from '../modules/audit/audit-repository';
import { createProposalsService } from '../modules/proposals/proposals-service';
import { createReleasesService } from '../modules/releases/releases-service';
import type { Database, Tx } from './client';

/** The invented source every demo proposal cites. */
export const REVIEW_DEMO_SOURCE_KEY = 'kpw-demo-review-2026';
const DEMO = 'Demo data — not a real measurement';
const FIRST_RATIONALE = `${DEMO}. Methane from the 2026 bench campaign, still being written up.`;

const CSL = {
  id: REVIEW_DEMO_SOURCE_KEY,
  type: 'report',
  title: `Kestrel Process Works internal calorimetry notes, 2026 (${DEMO}: invented for the demo scenario)`,
  author: [{ literal: 'Kestrel Process Works, process-data team (fictional)' }],
  publisher: 'Kestrel Process Works (a fictional company)',
  issued: { 'date-parts': [[2026]] },
  note: `${DEMO}. Never use these numbers.`,
};

const loginOf = (role: string) => DEMO_ACCOUNTS.find((a) => a.login === role)!;

/**
 * The review screens' demo scenario, added once: proposals by the demo team in every state —
 * a draft, one awaiting review, one sent back with a comment thread, a rejected one and an
 * approved one whose new species and value are accepted and wait for the next release. Every
 * number is invented and cites the demo source, labelled as such. Runs inside the caller's
 * transaction; the proposal service's own transactions become savepoints of it.
 */
export async function seedDemoProposals(tx: Tx): Promise<boolean> {
  await tx.execute(sql`select pg_advisory_xact_lock(${0x6b707770})`); // "kpwp"
  const [done] = await tx
    .select({ id: proposals.id })
    .from(proposals)
    .where(eq(proposals.rationale, FIRST_RATIONALE));
  if (done) return false;

  const people = await tx
    .select({ id: users.id, login: users.login })
    .from(users)
    .where(
      inArray(
        users.githubId,
        DEMO_ACCOUNTS.map((a) => a.githubId),
      ),
    );
  const id = (login: string) => ({ id: people.find((p) => p.login === loginOf(login).login)!.id });
  const [curator, editor, editor2] = ['demo-curator', 'demo-editor', 'demo-editor-2'].map(id);

  const [made] = await tx
    .insert(sources)
    .values({
      key: REVIEW_DEMO_SOURCE_KEY,
      csl: CSL,
      citation: `Kestrel Process Works (fictional). Internal calorimetry notes, 2026. ${DEMO}.`,
    })
    .onConflictDoNothing({ target: sources.key })
    .returning({ id: sources.id });
  const [source] = await tx
    .select({ id: sources.id })
    .from(sources)
    .where(eq(sources.key, REVIEW_DEMO_SOURCE_KEY));
  if (made)
    await recordAudit(tx, {
      actorId: null,
      action: 'source.seeded',
      entityType: 'source',
      entityId: made.id,
      after: { key: REVIEW_DEMO_SOURCE_KEY },
    });
  const sourceId = String(source!.id);

  const service = createProposalsService({
    db: tx as unknown as Database,
    releases: createReleasesService(tx as unknown as Database),
  });
  const value = (
    species: string,
    phase: string,
    kJ: number,
    u: number,
    kind = 'supersede_value',
  ) => ({
    kind,
    species,
    phase,
    quantity: 'formation_enthalpy',
    value: kJ,
    unit: 'kJ/mol',
    uncertainty: u,
    uncertaintyBasis: 'expanded_k2',
    method: 'combustion_calorimetry',
    sourceId,
    notes: DEMO,
  });
  const create = async (rationale: string, items: Record<string, unknown>[]) =>
    (await service.create(curator!, { rationale, items: items as never })).id;

  // A draft, not yet shown to anyone.
  await create(FIRST_RATIONALE, [value('methane', 'g', -74.9, 0.4)]);

  // Awaiting review.
  const pending = await create(`${DEMO}. Ethanol (liquid) from the solvent-recovery study.`, [
    value('ethanol', 'l', -277.2, 0.5),
  ]);
  await service.submit(curator!, pending);

  // Sent back, with a thread.
  const sentBack = await create(`${DEMO}. Ammonia (gas) re-measured on the new calorimeter.`, [
    value('ammonia', 'g', -46.6, 0.3),
  ]);
  await service.submit(curator!, sentBack);
  await service.decide(
    editor!,
    sentBack,
    'request_changes',
    'The difference from the current value is well over twice the combined uncertainty. Which calibration was used?',
  );
  const priya = { ...curator!, login: 'demo-curator', name: loginOf('demo-curator').name };
  await service.comment(
    priya,
    sentBack,
    'Benzoic-acid calibration of March; I will attach the run sheet and state the basis.',
  );

  // Rejected.
  const rejected = await create(`${DEMO}. Benzene (liquid) from a single run.`, [
    value('benzene', 'l', 51.0, 2.0),
  ]);
  await service.submit(curator!, rejected);
  await service.decide(
    editor2!,
    rejected,
    'reject',
    'One run cannot replace an evaluated value; please propose it again with the full series.',
  );

  // Approved: a new species and its value, accepted and waiting for the next release.
  const approved = await create(`${DEMO}. A plant stream component not yet in the registry.`, [
    {
      kind: 'add_species',
      key: 'kpw-demo-triptane',
      name: '2,2,3-Trimethylbutane (demo entry)',
      formula: 'C7H16',
      synonyms: ['triptane'],
      notes: DEMO,
      phases: [{ phase: 'l' }],
    },
    value('kpw-demo-triptane', 'l', -236.5, 1.2, 'add_value'),
  ]);
  await service.submit(curator!, approved);
  await service.decide(
    editor!,
    approved,
    'approve',
    'Consistent with the isomer series; accepted for the next release.',
  );
  return true;
}
