import type { ParseScheduleOptions } from "@/lib/engine/intake";
import type { Material } from "@/lib/engine/materials";
import type { CatalogueSection, LimitProfile } from "@/lib/engine/model";
import type { TransactionSql } from "postgres";

import { getSql } from "@/db/client";

import { loadCurrentLimitProfile } from "./limit-profiles";
import { loadOrganizationMaterials } from "./organization-materials";
import { loadCataloguesInUse } from "./section-catalogues";

/**
 * What a schedule is checked with beyond its own document: the organization's catalogues in use
 * (section names and the lightest-section suggestion), its materials and the limit profile the
 * schedule names. Plain data: it travels to the workers as it is.
 */
export interface ScheduleCriteria {
  catalogue: CatalogueSection[];
  materials: Material[];
  /** The organization profile `profile.id` named, resolved at its exact version. */
  profile: { id: string; version: number; profile: LimitProfile } | null;
}

/** The parse options a schedule is read with, the same at submission, in the worker and on a member's page. */
export function toParseOptions(criteria: ScheduleCriteria | null): Pick<ParseScheduleOptions, "catalogue" | "organizationMaterials" | "organizationProfiles"> {
  if (criteria === null) return {};
  return {
    catalogue: criteria.catalogue,
    organizationMaterials: new Map(criteria.materials.map((m) => [m.id, m])),
    organizationProfiles: new Map(criteria.profile ? [[criteria.profile.id, criteria.profile.profile]] : []),
  };
}

/** Records which materials intake looked up, so a schedule stores only those it names. */
class RecordingLookup<T> {
  readonly used = new Map<string, T>();
  constructor(private readonly all: ReadonlyMap<string, T>) {}
  get(id: string): T | undefined {
    const found = this.all.get(id);
    if (found !== undefined) this.used.set(id, found);
    return found;
  }
}

export interface SubmissionCriteria {
  catalogueIds: string[];
  options: Pick<ParseScheduleOptions, "catalogue" | "organizationMaterials" | "organizationProfiles">;
  /** After parsing: the criteria to freeze with the schedule. */
  freeze(): ScheduleCriteria;
}

function readNamedProfileId(doc: unknown): string | null {
  if (typeof doc !== "object" || doc === null) return null;
  const profile = (doc as Record<string, unknown>).profile;
  if (typeof profile !== "object" || profile === null) return null;
  const id = (profile as Record<string, unknown>).id;
  return typeof id === "string" ? id.trim() : null;
}

/** Loads the organization's live criteria for a submission (three queries, whatever the schedule's size). */
export async function loadSubmissionCriteria(organizationId: string, doc: unknown): Promise<SubmissionCriteria> {
  const profileId = readNamedProfileId(doc);
  const [catalogues, materials, profile] = await Promise.all([
    loadCataloguesInUse(organizationId),
    loadOrganizationMaterials(organizationId),
    profileId === null ? null : loadCurrentLimitProfile(organizationId, profileId),
  ]);
  const recording = new RecordingLookup(materials);
  return {
    catalogueIds: catalogues.catalogueIds,
    options: {
      catalogue: catalogues.sections,
      organizationMaterials: recording,
      organizationProfiles: new Map(profile ? [[profile.id, profile.profile]] : []),
    },
    freeze: () => ({ catalogue: catalogues.sections, materials: [...recording.used.values()], profile }),
  };
}

/** Stores a schedule's frozen criteria in the submitting transaction; nothing for a schedule that uses none. */
export async function storeScheduleCriteria(tx: TransactionSql, scheduleId: string, catalogueIds: string[], criteria: ScheduleCriteria, recheckOfScheduleId: string | null): Promise<void> {
  if (criteria.catalogue.length === 0 && criteria.materials.length === 0 && criteria.profile === null && recheckOfScheduleId === null) return;
  await tx`
    insert into schedule_criteria (schedule_id, profile_id, profile_version, recheck_of_schedule_id, catalogue_ids, catalogue, materials)
    values (${scheduleId}, ${criteria.profile?.id ?? null}, ${criteria.profile?.version ?? null}, ${recheckOfScheduleId}, ${tx.array(catalogueIds)},
      ${JSON.stringify(criteria.catalogue)}::jsonb, ${JSON.stringify(criteria.materials)}::jsonb)`;
}

export interface StoredScheduleCriteria extends ScheduleCriteria {
  recheckOfScheduleId: string | null;
}

/**
 * A schedule's frozen criteria, null for one that used none. The profile is the one stored with
 * the schedule (schedules.profile), so a later edit of the organization profile changes nothing.
 */
export async function loadScheduleCriteria(scheduleId: string): Promise<StoredScheduleCriteria | null> {
  const [row] = await getSql()`
    select c.profile_id, c.profile_version, c.recheck_of_schedule_id, c.catalogue, c.materials, s.profile
    from schedule_criteria c join schedules s on s.id = c.schedule_id where c.schedule_id = ${scheduleId}`;
  if (!row) return null;
  const profileId = row.profile_id as string | null;
  return {
    catalogue: row.catalogue as CatalogueSection[],
    materials: row.materials as Material[],
    profile: profileId === null ? null : { id: profileId, version: row.profile_version as number, profile: row.profile as LimitProfile },
    recheckOfScheduleId: (row.recheck_of_schedule_id as string | null) ?? null,
  };
}
