import { asc, eq, getTableColumns, sql } from 'drizzle-orm';
import { users, type Role, type UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import { AppError } from '../../lib/app-error';
import { hasRole } from './roles';

type Queryable = Database | Tx;

export interface GithubIdentity {
  githubId: number;
  login: string;
  name: string;
  email: string | null;
  avatarUrl: string | null;
}

export const usersRepository = {
  findById(db: Queryable, id: number): Promise<UserRow | undefined> {
    return db.query.users.findFirst({ where: eq(users.id, id) });
  },

  list(db: Queryable): Promise<UserRow[]> {
    return db.select().from(users).orderBy(asc(users.login), asc(users.id));
  },

  /** Locks the row so concurrent role changes serialise. */
  async findByIdForUpdate(tx: Tx, id: number): Promise<UserRow | undefined> {
    const [row] = await tx.select().from(users).where(eq(users.id, id)).for('update');
    return row;
  },

  /**
   * Locks every admin row, in id order so concurrent callers cannot deadlock: two admins
   * demoting each other at once cannot both succeed.
   */
  async lockAdmins(tx: Tx): Promise<number> {
    const rows = await tx
      .select({ id: users.id })
      .from(users)
      .where(eq(users.role, 'admin'))
      .orderBy(asc(users.id))
      .for('update');
    return rows.length;
  },

  /**
   * Every privileged transition calls this first inside its transaction: it locks the acting
   * user's row (`SELECT … FOR UPDATE`) and re-reads the role under that lock, so a role taken
   * away while the request was on its way is honoured; a demotion that commits later waits for
   * this transaction. Throws 403 `role_revoked` when the actor no longer holds `minimum`.
   */
  async assertActorRoleLocked(tx: Tx, actorId: number, minimum: Role): Promise<UserRow> {
    const [actor] = await tx.select().from(users).where(eq(users.id, actorId)).for('update');
    if (!actor || !hasRole(actor.role, minimum)) {
      throw new AppError(
        403,
        'role_revoked',
        `This needs the ${minimum} role, which your account no longer holds`,
      );
    }
    return actor;
  },

  async setEmailNotifications(tx: Tx, id: number, on: boolean): Promise<UserRow> {
    const [row] = await tx
      .update(users)
      .set({ emailNotifications: on })
      .where(eq(users.id, id))
      .returning();
    return row;
  },

  async setRole(tx: Tx, id: number, role: Role): Promise<UserRow> {
    const [row] = await tx.update(users).set({ role }).where(eq(users.id, id)).returning();
    return row;
  },

  /**
   * Creates the user on first sign-in or refreshes the profile afterwards. `inserted` tells the
   * two apart (xmax is 0 only for a freshly inserted row).
   */
  /** Inserts the accounts that do not exist yet (matched by GitHub id); returns those inserted. */
  insertMissing(db: Queryable, rows: (GithubIdentity & { role: Role })[]): Promise<UserRow[]> {
    return db
      .insert(users)
      .values(rows)
      .onConflictDoNothing({ target: users.githubId })
      .returning();
  },

  async upsertFromGithub(
    tx: Tx,
    identity: GithubIdentity,
    roleIfNew: Role,
  ): Promise<{ user: UserRow; inserted: boolean }> {
    const [row] = await tx
      .insert(users)
      .values({ ...identity, role: roleIfNew, lastSignInAt: new Date() })
      .onConflictDoUpdate({
        target: users.githubId,
        set: {
          login: identity.login,
          name: identity.name,
          email: identity.email,
          avatarUrl: identity.avatarUrl,
          lastSignInAt: new Date(),
        },
      })
      .returning({ ...getTableColumns(users), inserted: sql<boolean>`(xmax = 0)` });
    const { inserted, ...user } = row;
    return { user, inserted };
  },
};
