import { DEMO_ACCOUNTS } from '../fakes/demo-accounts';
import { recordAudits } from '../modules/audit/audit-repository';
import { seedUploadDemoSource } from '../modules/uploads/upload-demo-source';
import { usersRepository } from '../modules/users/users-repository';
import type { Database } from './client';
import { seedDemoProposals } from './seed-demo-proposals';

/**
 * Loads the demo data once: rows that already exist (matched by GitHub id) are left alone, so
 * role changes made in the running app survive a restart. Each account it creates, and the
 * role it is given, is audited in the same transaction (actor: the system, i.e. none).
 */
export async function seedDemoData(db: Database): Promise<void> {
  await db.transaction(async (tx) => {
    const inserted = await usersRepository.insertMissing(
      tx,
      DEMO_ACCOUNTS.map((a) => ({
        githubId: a.githubId,
        login: a.login,
        name: a.name,
        email: a.email,
        avatarUrl: null,
        role: a.role,
      })),
    );
    await recordAudits(
      tx,
      inserted.map((u) => ({
        actorId: null,
        action: 'user.seeded',
        entityType: 'user',
        entityId: u.id,
        after: { login: u.login, role: u.role },
      })),
    );
    await seedUploadDemoSource(tx);
    await seedDemoProposals(tx);
  });
}
