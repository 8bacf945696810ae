import { and, eq, inArray, isNotNull, ne, or } from 'drizzle-orm';
import { users, type Role } from '../../../../schema';
import type { Tx } from '../../db/client';

export interface Recipient {
  id: number;
  email: string;
}

export const notificationsRepository = {
  /**
   * Users who want e-mail and have an address, chosen by id or by role, never `exceptId` (the
   * one who acted). Read inside the event's transaction, so a setting changed a moment ago counts.
   */
  async recipients(
    tx: Tx,
    who: { ids?: readonly number[]; roles?: readonly Role[]; exceptId: number },
  ): Promise<Recipient[]> {
    const ids = who.ids?.length ? inArray(users.id, [...who.ids]) : undefined;
    const roles = who.roles?.length ? inArray(users.role, [...who.roles]) : undefined;
    if (!ids && !roles) return [];
    const rows = await tx
      .select({ id: users.id, email: users.email })
      .from(users)
      .where(
        and(
          or(ids, roles),
          ne(users.id, who.exceptId),
          eq(users.emailNotifications, true),
          isNotNull(users.email),
        ),
      )
      .orderBy(users.id);
    return rows.filter((r): r is Recipient => Boolean(r.email?.trim()));
  },
};
