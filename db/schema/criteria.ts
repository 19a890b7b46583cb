import { sql } from "drizzle-orm";
import { boolean, doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";

import { organizations } from "./organizations";
import { schedules } from "./schedules";
import { users } from "./users";

/**
 * An organization's section catalogue: named sections with their properties. Catalogues marked
 * in use resolve section names in schedules and feed the lightest-section suggestion.
 */
export const sectionCatalogues = pgTable(
  "section_catalogues",
  {
    /** Public id, `cat_...`. */
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    name: text().notNull(),
    /** Where the properties come from (a manufacturer's table, an in-house calculation, "invented"). */
    source: text().notNull(),
    inUse: boolean().notNull().default(true),
    sectionCount: integer().notNull().default(0),
    createdByUserId: text().references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("section_catalogues_organization_id_name_idx").on(t.organizationId, sql`lower(${t.name})`)],
);

/** One row per section, internal units (mm^4, mm^2, kg/m); written all at once by an import. */
export const catalogueSections = pgTable(
  "catalogue_sections",
  {
    catalogueId: text()
      .notNull()
      .references(() => sectionCatalogues.id, { onDelete: "cascade" }),
    /** Order in the imported file, from 0: ties in mass keep it. */
    position: integer().notNull(),
    name: text().notNull(),
    /** The name without spaces, lower case: names are unique per catalogue on this key. */
    nameKey: text().notNull(),
    iMm4: doublePrecision().notNull(),
    areaMm2: doublePrecision().notNull(),
    massKgPerM: doublePrecision().notNull(),
    shearAreaMm2: doublePrecision(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.catalogueId, t.position] }), uniqueIndex("catalogue_sections_catalogue_id_name_key_idx").on(t.catalogueId, t.nameKey)],
);

/** An organization's limit profile; its definitions live in versions, never edited in place. */
export const limitProfiles = pgTable(
  "limit_profiles",
  {
    /** Public id, `lp_...`; a schedule names it in `profile.id`. */
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    /** The current version's label and source, for lists. */
    label: text().notNull(),
    source: text().notNull(),
    /** The preset it was copied from, when it was. */
    basedOnPreset: text(),
    currentVersion: integer().notNull().default(1),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("limit_profiles_organization_id_idx").on(t.organizationId)],
);

/** Append-only: an edit adds a version, so a schedule's recorded version always reads back as checked. */
export const limitProfileVersions = pgTable(
  "limit_profile_versions",
  {
    profileId: text()
      .notNull()
      .references(() => limitProfiles.id, { onDelete: "cascade" }),
    version: integer().notNull(),
    label: text().notNull(),
    source: text().notNull(),
    /** The definition as edited: the public `profile.custom` format (api-schemas/v1/schedule.schema.json). */
    definition: jsonb().notNull(),
    /** The engine profile it resolves to (lib/engine/model.ts LimitProfile). */
    resolved: jsonb().notNull(),
    createdByUserId: text().references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.profileId, t.version] })],
);

export const organizationMaterialFamilies = ["steel", "aluminium", "timber", "custom"] as const;
export type OrganizationMaterialFamily = (typeof organizationMaterialFamilies)[number];

/** An organization's own material, usable by id (`mat_...`) beside the library ones. Internal units. */
export const organizationMaterials = pgTable(
  "organization_materials",
  {
    id: text().primaryKey(),
    organizationId: text()
      .notNull()
      .references(() => organizations.id, { onDelete: "cascade" }),
    name: text().notNull(),
    /** Decides the creep rules intake applies (lib/engine/intake/read-material.ts). */
    family: text({ enum: organizationMaterialFamilies }).notNull(),
    eMpa: doublePrecision().notNull(),
    gMpa: doublePrecision(),
    densityKgPerM3: doublePrecision("density_kg_per_m3"),
    /** A fixed creep factor; null: the family's rule (metals none, timber from the member's creep). */
    creepFactor: doublePrecision(),
    source: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("organization_materials_organization_id_name_idx").on(t.organizationId, sql`lower(${t.name})`)],
);

/**
 * What a schedule was checked with beyond its own document, frozen at submission: the profile
 * version, the organization materials it named and the catalogue sections in use. Workers and
 * member pages read this, never the live settings, so an edit never changes a stored result.
 */
export const scheduleCriteria = pgTable("schedule_criteria", {
  scheduleId: text()
    .primaryKey()
    .references(() => schedules.id, { onDelete: "cascade" }),
  profileId: text(),
  profileVersion: integer(),
  /** The schedule this one rechecks with a newer profile version. */
  recheckOfScheduleId: text(),
  catalogueIds: text().array().notNull(),
  /** CatalogueSection[] (lib/engine/model.ts). */
  catalogue: jsonb().notNull(),
  /** Material[] (lib/engine/materials.ts), only those the schedule names. */
  materials: jsonb().notNull(),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
