import type { Role, UserRow } from '../../../../schema';
import type { Database } from '../../db/client';
import { AppError, notFound } from '../../lib/app-error';
import { recordAudit } from '../audit/audit-repository';
import { usersRepository, type GithubIdentity } from './users-repository';

export function createUsersService(db: Database, adminLogins: readonly string[]) {
  return {
    list: () => usersRepository.list(db),

    findById: (id: number) => usersRepository.findById(db, id),

    /** Changes a role and audits it in one transaction; the last admin cannot be demoted. */
    changeRole(actor: UserRow, id: number, role: Role): Promise<UserRow> {
      return db.transaction(async (tx) => {
        const adminCount = await usersRepository.lockAdmins(tx);
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
        return user;
      });
    },
  };
}

export type UsersService = ReturnType<typeof createUsersService>;
