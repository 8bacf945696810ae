import type { Role, UserRow } from '../../../../schema';
import type { Database } from '../../db/client';
import { AppError, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { usersRepository, type GithubIdentity } from './users-repository';

const isRefusal = (err: unknown) =>
  err instanceof AppError && (err.code === 'forbidden' || err.code === 'role_revoked');

export function createUsersService(db: Database, adminLogins: readonly string[]) {
  /** A refused privileged attempt is audited as its own action, without the change it asked for. */
  const recordRefusal = (actorId: number, action: string, entityType: string, entityId: number) =>
    recordAudit(db, { actorId, action, entityType, entityId });

  return {
    list: () => usersRepository.list(db),

    findById: (id: number) => usersRepository.findById(db, id),

    recordRefusal,

    /**
     * Changes a role and audits it in one transaction. The actor's own admin role is re-checked
     * under lock inside the transaction; the last admin cannot be demoted.
     */
    async changeRole(actor: UserRow, id: number, role: Role): Promise<UserRow> {
      try {
        return await db.transaction(async (tx) => {
          // Admin rows first (in id order), then the actor: one lock order for every caller.
          const adminCount = await usersRepository.lockAdmins(tx);
          await usersRepository.assertActorRoleLocked(tx, actor.id, 'admin');
          const target = await usersRepository.findByIdForUpdate(tx, id);
          if (!target) throw notFound(`User ${id}`);
          if (target.role === role) return target;
          if (target.role === 'admin' && adminCount <= 1) {
            throw new AppError(
              409,
              'last_admin',
              `${target.login} is the last admin and cannot be demoted`,
            );
          }
          const updated = await usersRepository.setRole(tx, id, role);
          await recordAudit(tx, {
            actorId: actor.id,
            action: 'user.role_changed',
            entityType: 'user',
            entityId: id,
            before: { role: target.role },
            after: { role: updated.role },
          });
          return updated;
        });
      } catch (err) {
        if (isRefusal(err)) await recordRefusal(actor.id, 'user.role_change_refused', 'user', id);
        throw err;
      }
    },

    /** The caller's own settings, read fresh (the session's copy may be older). */
    async settings(userId: number): Promise<UserRow> {
      const user = await usersRepository.findById(db, userId);
      if (!user) throw notFound(`User ${userId}`);
      return user;
    },

    /** Changes the caller's own settings and audits the change in one transaction. */
    updateSettings(userId: number, patch: { emailNotifications: boolean }): Promise<UserRow> {
      return db.transaction(async (tx) => {
        const current = await usersRepository.findByIdForUpdate(tx, userId);
        if (!current) throw notFound(`User ${userId}`);
        if (current.emailNotifications === patch.emailNotifications) return current;
        const updated = await usersRepository.setEmailNotifications(
          tx,
          userId,
          patch.emailNotifications,
        );
        await recordAudit(tx, {
          actorId: userId,
          action: 'user.settings_changed',
          entityType: 'user',
          entityId: userId,
          before: { emailNotifications: current.emailNotifications },
          after: { emailNotifications: updated.emailNotifications },
        });
        return updated;
      });
    },

    /** Sign-in: a new user is a reader unless bootstrapped as admin by configuration. */
    signIn(identity: GithubIdentity): Promise<UserRow> {
      return db.transaction(async (tx) => {
        const roleIfNew: Role = adminLogins.includes(identity.login) ? 'admin' : 'reader';
        const { user, inserted } = await usersRepository.upsertFromGithub(tx, identity, roleIfNew);
        if (inserted) {
          await recordAudit(tx, {
            actorId: user.id,
            action: 'user.created',
            entityType: 'user',
            entityId: user.id,
            after: { login: user.login, role: user.role },
          });
        }
        await recordAudit(tx, {
          actorId: user.id,
          action: 'user.signed_in',
          entityType: 'user',
          entityId: user.id,
        });
        return user;
      });
    },

    recordSignOut: (userId: number) =>
      recordAudit(db, {
        actorId: userId,
        action: 'user.signed_out',
        entityType: 'user',
        entityId: userId,
      }),
  };
}

export type UsersService = ReturnType<typeof createUsersService>;
