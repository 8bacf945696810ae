import { users } from '../../../schema';
import { DEMO_ACCOUNTS } from '../fakes/demo-accounts';
import type { Database } from './client';

/**
 * Loads the demo data once: rows that already exist (matched by GitHub id) are left alone, so
 * role changes made in the running app survive a restart.
 */
export async function seedDemoData(db: Database): Promise<void> {
  await db
    .insert(users)
    .values(
      DEMO_ACCOUNTS.map((a) => ({
        githubId: a.githubId,
        login: a.login,
        name: a.name,
        email: a.email,
        role: a.role,
      })),
    )
    .onConflictDoNothing({ target: users.githubId });
}
