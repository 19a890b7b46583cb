import { sql } from "drizzle-orm";
import { index, integer, pgTable, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";

import { organizations } from "./organizations";

export const roles = ["admin", "engineer", "integrator", "submitter", "viewer"] as const;
export type Role = (typeof roles)[number];

export const users = pgTable(
  "users",
  {
    id: text().primaryKey(),
    email: text().notNull(),
    name: text().notNull(),
    passwordHash: text().notNull(),
    // Carried in the session token; a password reset increments it, signing out every other device.
    sessionVersion: integer().notNull().default(0),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("users_email_idx").on(sql`lower(${t.email})`)],
);

export const memberships = pgTable(
  "memberships",
  {
    id: text().primaryKey(),
    userId: text()
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    role: text({ enum: roles }).notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("memberships_user_id_organization_id_idx").on(t.userId, t.organizationId),
    index("memberships_organization_id_idx").on(t.organizationId),
  ],
);

/**
 * Sign-in attempts per normalised e-mail, known or not, so throttling reveals nothing. `failures`
 * counts the attempts of the window, each counted before its password check; a success deletes
 * the row. Rows are purged on a schedule once their window and lock are over.
 */
export const signInThrottles = pgTable(
  "sign_in_throttles",
  {
    emailKey: text().primaryKey(),
    failures: integer().notNull().default(0),
    windowStartedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    lockedUntil: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("sign_in_throttles_updated_at_idx").on(t.updatedAt)],
);
