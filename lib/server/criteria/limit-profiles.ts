import { parseLimitProfile } from "@/lib/engine/intake";
import type { LimitProfile } from "@/lib/engine/model";
import { getPreset, listPresetIds } from "@/lib/engine/presets";
import { getSql } from "@/db/client";
import { DomainError } from "@/lib/server/errors";
import { createId } from "@/lib/server/ids";
import { issuesToFieldErrors } from "@/lib/server/schedules/issue-pointers";

import { lockCriteriaCaps } from "./lock-criteria-caps";

export const MAX_LIMIT_PROFILES = 200;

/**
 * What a person or a key writes (api-schemas/v1/limit-profile-write.schema.json; the settings
 * screen's form schema): a label and a source, and either a preset to copy or the definition (the
 * public `profile.custom` format without id, label and source, which Sagline sets).
 */
export interface LimitProfileInput {
  label: string;
  source: string;
  basedOnPreset?: string;
  definition?: Record<string, unknown>;
  /** For an edit: the version the change was made from; another edit in between is a conflict. */
  expectedVersion?: number;
}

export interface LimitProfileSummary {
  id: string;
  label: string;
  source: string;
  basedOnPreset: string | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface LimitProfileVersionView {
  version: number;
  label: string;
  source: string;
  definition: Record<string, unknown>;
  createdAt: string;
}

/** The public `profile.custom` form of an engine profile: quantities carry their units. */
export function describeProfileDefinition(profile: LimitProfile): Record<string, unknown> {
  return {
    combinations: profile.combinations.map((c) => ({
      id: c.id,
      label: c.label,
      factors: { ...c.factors },
      ...(c.sustainedFactors ? { sustainedFactors: { ...c.sustainedFactors } } : {}),
      ...(c.creep === undefined ? {} : { creep: c.creep }),
      limitRatio: c.limitRatio,
      ...(c.cantileverLimitRatio === undefined ? {} : { cantileverLimitRatio: c.cantileverLimitRatio }),
      ...(c.capMm === undefined ? {} : { cap: { value: c.capMm, unit: "mm" } }),
    })),
    cantileverSpanMultiplier: profile.cantileverSpanMultiplier,
    ...(profile.frequency ? { frequency: { min: { value: profile.frequency.minHz, unit: "Hz" }, massFactors: { ...profile.frequency.massFactors } } } : {}),
    ...(profile.patternLoads === undefined ? {} : { patternLoads: profile.patternLoads }),
    ...(profile.variableCases === undefined ? {} : { variableCases: [...profile.variableCases] }),
  };
}

/** The engine profile's id: the public id and version, so results name exactly what they were checked with. */
function getEngineProfileId(profileId: string, version: number): string {
  return `${profileId}.v${version}`;
}

/** Label and source trimmed; blank after trimming is refused, naming the field. */
function readTexts(input: LimitProfileInput): LimitProfileInput {
  const label = input.label.trim();
  const source = input.source.trim();
  const errors = [
    ...(label === "" || label.length > 200 ? [{ pointer: "/label", message: "must be 1 to 200 characters" }] : []),
    ...(source === "" || source.length > 500 ? [{ pointer: "/source", message: "must be 1 to 500 characters: the published source or the in-house rule" }] : []),
  ];
  if (errors.length > 0) throw new DomainError("invalid_input", "The profile needs a label and a source.", errors);
  return { ...input, label, source };
}

function resolveDefinition(profileId: string, version: number, input: LimitProfileInput, previous: Record<string, unknown> | null) {
  let body = input.definition ?? null;
  if (input.basedOnPreset !== undefined && input.definition === undefined) {
    const preset = getPreset(input.basedOnPreset);
    if (!preset) throw new DomainError("invalid_input", "Unknown preset.", [{ pointer: "/basedOnPreset", message: `unknown preset; presets: ${listPresetIds().join(", ")}` }]);
    body = describeProfileDefinition(preset);
  }
  body ??= previous;
  if (body === null) throw new DomainError("invalid_input", "Give a preset to copy or a definition.", [{ pointer: "/definition", message: "is required (or basedOnPreset)" }]);
  const { id: _id, label: _label, source: _source, ...rest } = body;
  const definition = { id: getEngineProfileId(profileId, version), label: input.label, source: input.source, ...rest };
  const parsed = parseLimitProfile(definition);
  if (!parsed.ok) {
    const errors = issuesToFieldErrors(parsed.issues).map((e) => ({ ...e, pointer: `/definition${e.pointer ?? ""}` }));
    throw new DomainError("invalid_input", `The limit profile has ${errors.length} problem${errors.length === 1 ? "" : "s"}; nothing was saved.`, errors);
  }
  return { definition: rest, resolved: parsed.profile };
}

function toSummary(row: Record<string, unknown>): LimitProfileSummary {
  return {
    id: row.id as string,
    label: row.label as string,
    source: row.source as string,
    basedOnPreset: (row.based_on_preset as string | null) ?? null,
    version: row.current_version as number,
    createdAt: new Date(row.created_at as string).toISOString(),
    updatedAt: new Date(row.updated_at as string).toISOString(),
  };
}

export async function listLimitProfiles(organizationId: string): Promise<LimitProfileSummary[]> {
  const rows = await getSql()`select * from limit_profiles where organization_id = ${organizationId} order by lower(label), id`;
  return rows.map(toSummary);
}

/** A profile with every version, newest first. */
export async function getLimitProfileOrThrow(organizationId: string, profileId: string): Promise<LimitProfileSummary & { versions: LimitProfileVersionView[] }> {
  const sql = getSql();
  const [row] = await sql`select * from limit_profiles where id = ${profileId} and organization_id = ${organizationId}`;
  if (!row) throw new DomainError("not_found", "The limit profile was not found.");
  const versions = await sql`select version, label, source, definition, created_at from limit_profile_versions where profile_id = ${profileId} order by version desc`;
  return {
    ...toSummary(row),
    versions: versions.map((v) => ({
      version: v.version as number,
      label: v.label as string,
      source: v.source as string,
      definition: v.definition as Record<string, unknown>,
      createdAt: new Date(v.created_at as string).toISOString(),
    })),
  };
}

export async function createLimitProfile(organizationId: string, given: LimitProfileInput, userId: string | null = null): Promise<LimitProfileSummary> {
  const input = readTexts(given);
  const id = createId("lp");
  const { definition, resolved } = resolveDefinition(id, 1, input, null);
  return getSql().begin(async (tx) => {
    await lockCriteriaCaps(tx, organizationId);
    const [count] = await tx`select count(*)::int as n from limit_profiles where organization_id = ${organizationId}`;
    if ((count?.n as number) >= MAX_LIMIT_PROFILES) throw new DomainError("conflict", `The organization already has ${MAX_LIMIT_PROFILES} limit profiles, the most it may hold.`);
    const [row] = await tx`
      insert into limit_profiles (id, organization_id, label, source, based_on_preset, current_version)
      values (${id}, ${organizationId}, ${input.label}, ${input.source}, ${input.basedOnPreset ?? null}, 1) returning *`;
    await tx`
      insert into limit_profile_versions (profile_id, version, label, source, definition, resolved, created_by_user_id)
      values (${id}, 1, ${input.label}, ${input.source}, ${JSON.stringify(definition)}::jsonb, ${JSON.stringify(resolved)}::jsonb, ${userId})`;
    return toSummary(row!);
  });
}

/**
 * Saves an edit as a new version; earlier versions, and every schedule checked against them,
 * stay as they were. With expectedVersion, an edit made from an older version is a conflict.
 */
export async function updateLimitProfile(organizationId: string, profileId: string, given: LimitProfileInput, userId: string | null = null): Promise<LimitProfileSummary> {
  const input = readTexts(given);
  return getSql().begin(async (tx) => {
    const [current] = await tx`select * from limit_profiles where id = ${profileId} and organization_id = ${organizationId} for update`;
    if (!current) throw new DomainError("not_found", "The limit profile was not found.");
    const currentVersion = current.current_version as number;
    if (input.expectedVersion !== undefined && input.expectedVersion !== currentVersion) {
      throw new DomainError("conflict", `The profile is at version ${currentVersion} now, not ${input.expectedVersion}: someone else saved a change. Reload and edit again.`);
    }
    const [previous] = await tx`select definition from limit_profile_versions where profile_id = ${profileId} and version = ${currentVersion}`;
    const version = currentVersion + 1;
    const { definition, resolved } = resolveDefinition(profileId, version, input, (previous?.definition as Record<string, unknown> | undefined) ?? null);
    await tx`
      insert into limit_profile_versions (profile_id, version, label, source, definition, resolved, created_by_user_id)
      values (${profileId}, ${version}, ${input.label}, ${input.source}, ${JSON.stringify(definition)}::jsonb, ${JSON.stringify(resolved)}::jsonb, ${userId})`;
    const [row] = await tx`
      update limit_profiles set label = ${input.label}, source = ${input.source}, current_version = ${version}, updated_at = now()
      where id = ${profileId} returning *`;
    return toSummary(row!);
  });
}

/** Removes a profile and its versions; schedules already checked keep the profile they were checked with (schedules.profile). */
export async function deleteLimitProfile(organizationId: string, profileId: string): Promise<void> {
  const rows = await getSql()`delete from limit_profiles where id = ${profileId} and organization_id = ${organizationId} returning id`;
  if (rows.length === 0) throw new DomainError("not_found", "The limit profile was not found.");
}

/** The current version of one of the organization's profiles, as a schedule naming it is checked; null when there is none. */
export async function loadCurrentLimitProfile(organizationId: string, profileId: string): Promise<{ id: string; version: number; profile: LimitProfile } | null> {
  const [row] = await getSql()`
    select p.id, v.version, v.resolved from limit_profiles p
    join limit_profile_versions v on v.profile_id = p.id and v.version = p.current_version
    where p.id = ${profileId} and p.organization_id = ${organizationId}`;
  return row ? { id: row.id as string, version: row.version as number, profile: row.resolved as LimitProfile } : null;
}
