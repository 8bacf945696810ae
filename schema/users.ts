import {
  bigint,
  boolean,
  index,
  integer,
  pgEnum,
  pgTable,
  text,
  timestamp,
} from 'drizzle-orm/pg-core';

/** Roles in increasing order of privilege; the order is used by the role guard. */
export const ROLES = ['reader', 'curator', 'editor', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const userRole = pgEnum('user_role', ROLES);

export const users = pgTable(
  'users',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    githubId: bigint({ mode: 'number' }).notNull().unique(),
    login: text().notNull(),
    name: text().notNull(),
    email: text(),
    avatarUrl: text(),
    role: userRole().notNull().default('reader'),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    lastSignInAt: timestamp({ withTimezone: true }),
    /** E-mail about proposals (submitted, decided, commented); each user can turn it off. */
    emailNotifications: boolean().notNull().default(true),
  },
  (t) => [index('users_login_idx').on(t.login)],
);

export type UserRow = typeof users.$inferSelect;
