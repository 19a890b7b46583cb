import { pgTable, text, timestamp } from "drizzle-orm/pg-core";

export const organizationKinds = ["engineering", "fabricator"] as const;

export const organizations = pgTable("organizations", {
  id: text().primaryKey(),
  name: text().notNull(),
  kind: text({ enum: organizationKinds }).notNull(),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

export const projects = pgTable("projects", {
  id: text().primaryKey(),
  organizationId: text()
    .notNull()
    .references(() => organizations.id, { onDelete: "cascade" }),
  name: text().notNull(),
  reference: text().notNull(),
  partnerOrganizationId: text().references(() => organizations.id, { onDelete: "set null" }),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
