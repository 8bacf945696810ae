import { eq, sql } from 'drizzle-orm';
import { sources, species, speciesPhases, users } from '../../../schema';
import { DEMO_ACCOUNTS } from '../fakes/demo-accounts';
import { recordAudit } from '../modules/audit/audit-repository';
import { draftRepository } from '../modules/releases/draft-repository';
import { createReleasesService, type ReleasesService } from '../modules/releases/releases-service';
import { acceptFormationValueIn } from './accepted-revisions';
import type { Database, Tx } from './client';

export const DEMO_RELEASE = '2026.2';
const DEMO_LOCK = 0x64656d6f; // "demo"
const DEMO_SOURCE_KEY = 'kestrel-demo-revisions';
const DEMO_LABEL =
  'Demo data (Kestrel Process Works scenario): an invented value for demonstration only, not for engineering use.';

/**
 * Invented ΔfH° values (J/mol) the demo's process-data team "re-evaluated". Used only when the
 * demo proposals have not accepted enough values of their own; without any from the proposals,
 * the last one is kept back, so one accepted value always awaits the next release.
 */
const DEMO_VALUES: { key: string; phase: 'g' | 'l'; value: string; uncertainty: string }[] = [
  { key: 'methane', phase: 'g', value: '-74600', uncertainty: '300' },
  { key: 'ethanol', phase: 'l', value: '-277100', uncertainty: '400' },
  { key: 'ammonia', phase: 'g', value: '-45900', uncertainty: '400' },
  { key: 'sulfur-dioxide', phase: 'g', value: '-296900', uncertainty: '200' },
  { key: 'propane', phase: 'g', value: '-104100', uncertainty: '500' },
];

export interface DemoReleaseResult {
  published: boolean;
  release: string;
  changes?: number;
  keptBack?: number;
}

/**
 * Publishes the demo's second release from the values accepted since the newest release (the
 * demo proposals' approvals, and invented demo values when there are too few), as the demo
 * editor, keeping the newest value the proposals accepted (or else the newest value) back for the
 * next release. Runs once: when the release exists (or the demo accounts do not), nothing is
 * written.
 */
export async function ensureDemoRelease(
  db: Database,
  releases: Pick<ReleasesService, 'createDraftIn' | 'publishIn'> = createReleasesService(db),
): Promise<DemoReleaseResult> {
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${DEMO_LOCK})`);
    const exists = await tx.execute(sql`select 1 from releases where version = ${DEMO_RELEASE}`);
    if ((exists.rowCount ?? 0) > 0) return { published: false, release: DEMO_RELEASE };
    const editor = await demoUser(tx, 'demo-editor');
    const curator = await demoUser(tx, 'demo-curator');
    if (!editor) return { published: false, release: DEMO_RELEASE };

    const draft = await releases.createDraftIn(
      tx,
      editor,
      DEMO_RELEASE,
      'Demo release (Kestrel Process Works scenario): values the process-data team re-evaluated. ' +
        'The numbers and their demo sources are invented for demonstration; not for engineering use.',
    );
    let changes = await draftRepository.changes(tx, draft);
    // What the demo proposals accepted: the newest of it waits for the next release, as their
    // story says; the demo's own values fill the release when the proposals accepted too few.
    const fromProposals = new Set(
      changes.filter((c) => c.change !== 'retired').map((c) => c.changeId),
    );
    if (changes.length < 3) {
      await acceptDemoValues(tx, curator?.id ?? editor.id);
      changes = await draftRepository.changes(tx, draft);
    }
    const values = changes.filter((c) => c.change !== 'retired');
    if (values.length < 2) throw new Error('the demo release found too few values to publish');
    const keepBackFrom =
      fromProposals.size > 0 ? [...fromProposals] : values.map((c) => c.changeId);
    const keptBack = Math.max(...keepBackFrom);
    await draftRepository.exclude(tx, draft.id, [keptBack], editor.id);
    const stale = await draftRepository.staleInputs(tx, draft);
    const staleIds = [...new Set(stale.map((s) => s.derivedId))];
    await draftRepository.acknowledge(tx, draft.id, staleIds, editor.id);
    await recordAudit(tx, {
      actorId: editor.id,
      action: 'release.draft_updated',
      entityType: 'release',
      entityId: draft.id,
      after: { excluded: [keptBack], acknowledged: staleIds, demo: true },
    });
    await releases.publishIn(tx, editor, DEMO_RELEASE);
    return {
      published: true,
      release: DEMO_RELEASE,
      changes: changes.length - 1,
      keptBack,
    };
  });
}

async function demoUser(tx: Tx, login: string) {
  const account = DEMO_ACCOUNTS.find((a) => a.login === login)!;
  const [row] = await tx
    .select({ id: users.id })
    .from(users)
    .where(eq(users.githubId, account.githubId));
  return row;
}

async function acceptDemoValues(tx: Tx, authorId: number): Promise<void> {
  const csl = {
    id: DEMO_SOURCE_KEY,
    type: 'report',
    title: 'Re-evaluation of plant reference values (demo data, invented)',
    author: [{ literal: 'Kestrel Process Works process-data team' }],
    publisher: 'Kestrel Process Works (a fictional company of the demo)',
    issued: { 'date-parts': [[2026]] },
  };
  await tx
    .insert(sources)
    .values({
      key: DEMO_SOURCE_KEY,
      csl,
      citation:
        'Kestrel Process Works process-data team (2026). Re-evaluation of plant reference values. ' +
        'Demo data: invented for demonstration, not for engineering use.',
      createdBy: authorId,
    })
    .onConflictDoNothing({ target: sources.key });
  const [source] = await tx
    .select({ id: sources.id })
    .from(sources)
    .where(eq(sources.key, DEMO_SOURCE_KEY));
  for (const v of DEMO_VALUES) {
    const [phase] = await tx
      .select({ id: speciesPhases.id })
      .from(speciesPhases)
      .innerJoin(species, eq(species.id, speciesPhases.speciesId))
      .where(
        sql`${species.key} = ${v.key} and ${speciesPhases.phase} = ${v.phase}
            and ${speciesPhases.modification} is null`,
      );
    if (!phase) continue;
    await acceptFormationValueIn(tx, {
      speciesPhaseId: phase.id,
      value: v.value,
      uncertainty: v.uncertainty,
      uncertaintyBasis: 'standard',
      method: 'evaluated',
      sourceId: source!.id,
      notes: DEMO_LABEL,
      createdBy: authorId,
    });
  }
}
