import { sources } from '../../../../schema';
import type { Tx } from '../../db/client';
import { recordAudits } from '../audit/audit-repository';

/** The invented source the upload samples in imports/samples/ cite (demo data only). */
export const UPLOAD_DEMO_SOURCE_KEY = 'kpw-demo-bench-2026';

const CSL = {
  id: UPLOAD_DEMO_SOURCE_KEY,
  type: 'report',
  title:
    'Bench calorimetry of solvent and fuel streams, 2026 campaign (DEMO DATA: invented for the Kestrel Process Works demo scenario; not real measurements)',
  author: [{ literal: 'Kestrel Process Works, process-data team (fictional)' }],
  publisher: 'Kestrel Process Works (a fictional company)',
  issued: { 'date-parts': [[2026]] },
  note: 'Demo data. Cited only by the bulk-upload samples; never use these numbers.',
};

/** Adds the demo source once (matched by key), with its audit row in the same transaction. */
export async function seedUploadDemoSource(tx: Tx): Promise<void> {
  const inserted = await tx
    .insert(sources)
    .values({
      key: UPLOAD_DEMO_SOURCE_KEY,
      csl: CSL,
      citation:
        'Kestrel Process Works, process-data team (fictional). Bench calorimetry of solvent and fuel streams, 2026 campaign. DEMO DATA, not real measurements. 2026.',
      doi: null,
      createdBy: null,
    })
    .onConflictDoNothing({ target: sources.key })
    .returning({ id: sources.id });
  await recordAudits(
    tx,
    inserted.map((s) => ({
      actorId: null,
      action: 'source.seeded',
      entityType: 'source',
      entityId: s.id,
      after: { key: UPLOAD_DEMO_SOURCE_KEY },
    })),
  );
}
