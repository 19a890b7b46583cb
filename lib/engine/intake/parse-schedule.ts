import type { Material } from "../materials";
import type { CatalogueSection, InputIssue, LimitProfile, Member } from "../model";
import { listProfileLoadCases } from "../presets";
import { createCatalogueIndex } from "../sections";
import type { UnitSystem } from "../units";
import { readMember, type MemberOrigins } from "./read-member";
import { readLimits } from "./read-profile";
import { readUnits } from "./read-units";
import { childPath, createFieldSpec, IssueCollector, joinPath, readObject, readString, type OrganizationLookup, type ReadContext } from "./read-values";

import { RETIRED_SCHEDULE_FORMATS, SCHEDULE_FORMAT } from "./schedule-format";

export { SCHEDULE_FORMAT };
export const MAX_MEMBERS = 100_000;
const DEFAULT_MAX_ISSUES = 1000;
const ROOT_SPEC = createFieldSpec(["format", "name", "reference", "notes", "units", "profile", "members"], ["format", "name", "units", "profile", "members"]);

export interface ParseScheduleOptions {
  /** Sections that `section: "name"` may refer to. */
  catalogue?: readonly CatalogueSection[];
  /** The organization's own materials: a member's `material: "<id>"` finds them before the library. */
  organizationMaterials?: OrganizationLookup<Material>;
  /** The organization's limit profiles: `limits: { "profile": "<id>" }` resolves through it. */
  organizationProfiles?: OrganizationLookup<LimitProfile>;
  /** Stop recording after this many issues (the count of the rest is reported). Default 1000. */
  maxIssues?: number;
  /**
   * Called with each member as soon as it is read, in order, with the schedule's limit profile
   * (only while the profile is valid). For a caller that checks members one at a time.
   */
  onMember?: (member: Member, index: number, profile: LimitProfile, origins: MemberOrigins) => void;
  /**
   * false: the result's members and origins stay empty, so a caller that only validates (with
   * onMember) holds no model of a large schedule in memory. Default true.
   */
  retainMembers?: boolean;
  /**
   * The schedule index of `members[0]` when the document holds a slice of a schedule (a worker's
   * chunk), so every path and origin names the member as the whole schedule numbers it. Default 0.
   */
  firstMemberIndex?: number;
}

export interface ParsedSchedule {
  format: typeof SCHEDULE_FORMAT;
  name: string;
  reference: string | null;
  unitSystem: UnitSystem | null;
  /** The unit text per kind that bare numbers took, for echoing results in the schedule's units. */
  unitDefaults: Record<string, string>;
  profile: LimitProfile;
  /** One per public member, same order: members[i] came from the path `members[firstMemberIndex + i]`. */
  members: Member[];
  /** Per member, the public path of each engine span and support (overhangs become spans). */
  origins: MemberOrigins[];
}

/**
 * On failure, `issues` ends with a "N more issues not listed" line when the cap was reached, and
 * `unlistedCount` is that N (0 otherwise), for callers that report the total themselves.
 */
export type ParseScheduleResult = { ok: true; schedule: ParsedSchedule } | { ok: false; issues: InputIssue[]; unlistedCount: number };

/**
 * Validates a public schedule document (already JSON-parsed) and converts it to the engine
 * model in internal units (mm, N, MPa; model.ts). Collects every problem, each with the path of
 * the field in the public format, e.g. `members[12].spans[1].length: must be greater than 0`.
 * Nothing is defaulted silently and no non-finite number passes.
 */
export function parseSchedule(doc: unknown, options: ParseScheduleOptions = {}): ParseScheduleResult {
  const issues = new IssueCollector(options.maxIssues ?? DEFAULT_MAX_ISSUES);
  const ctx: ReadContext = { issues, units: { system: null, byKind: {} } };
  if (options.organizationMaterials) ctx.organizationMaterials = options.organizationMaterials;
  if (options.organizationProfiles) ctx.organizationProfiles = options.organizationProfiles;
  const retired = getRetiredFormatMessage(doc);
  if (retired !== null) {
    issues.add("format", retired);
    return fail(issues);
  }
  const root = readObject(ctx, doc, "", ROOT_SPEC);
  if (!root) return fail(issues);
  if (root.format !== undefined && root.format !== SCHEDULE_FORMAT) issues.add("format", `must be "${SCHEDULE_FORMAT}"`);
  const name = root.name === undefined ? null : readString(ctx, root.name, "name", 200);
  const reference = root.reference === undefined ? null : readString(ctx, root.reference, "reference", 200);
  if (root.notes !== undefined) readString(ctx, root.notes, "notes", 5000);
  if (root.units !== undefined) ctx.units = readUnits(ctx, root.units, "units");
  const profile = root.profile === undefined ? null : readLimits(ctx, root.profile, "profile");

  const members: Member[] = [];
  const origins: MemberOrigins[] = [];
  const retainMembers = options.retainMembers ?? true;
  const firstMemberIndex = options.firstMemberIndex ?? 0;
  const membersValue = root.members;
  if (membersValue !== undefined && (!Array.isArray(membersValue) || membersValue.length === 0 || membersValue.length > MAX_MEMBERS)) {
    issues.add("members", `must be an array of 1 to ${MAX_MEMBERS} members`);
  } else if (Array.isArray(membersValue)) {
    const facts = profile
      ? {
          id: profile.id,
          cases: listProfileLoadCases(profile),
          usesCreep: profile.combinations.some((c) => c.creep === "material"),
          usesIbcCreep: profile.combinations.some((c) => c.creep === "ibc_creep_component"),
        }
      : { id: "(invalid)", cases: null, usesCreep: false };
    const findCatalogue = createCatalogueIndex(options.catalogue ?? []);
    // Indices, not path strings: the first member's path is only spelled out for a duplicate.
    const firstIndexByMark = new Map<string, number>();
    for (let index = 0; index < membersValue.length; index++) {
      const entry: unknown = membersValue[index];
      const path = joinPath("members", firstMemberIndex + index);
      const read = readMember(ctx, entry, path, facts, findCatalogue);
      const markValue = typeof entry === "object" && entry !== null ? (entry as Record<string, unknown>).mark : undefined;
      const mark = typeof markValue === "string" ? markValue.trim() : "";
      if (mark !== "") {
        const first = firstIndexByMark.get(mark);
        if (first !== undefined) issues.add(childPath(path, "mark"), `duplicate mark "${mark}" (first at ${joinPath("members", firstMemberIndex + first)})`);
        else firstIndexByMark.set(mark, index);
      }
      if (read) {
        if (options.onMember && profile) options.onMember(read.member, index, profile, read.origins);
        if (retainMembers) {
          members.push(read.member);
          origins.push(read.origins);
        }
      }
    }
  }
  if (issues.count > 0 || !profile || name === null) return fail(issues);
  return {
    ok: true,
    schedule: {
      format: SCHEDULE_FORMAT,
      name,
      reference,
      unitSystem: ctx.units.system,
      unitDefaults: { ...ctx.units.byKind },
      profile,
      members,
      origins,
    },
  };
}

/** What changed, when the document names a retired format (checked first: its other fields mean other things). */
export function getRetiredFormatMessage(doc: unknown): string | null {
  const format = typeof doc === "object" && doc !== null && !Array.isArray(doc) ? (doc as { format?: unknown }).format : undefined;
  return typeof format === "string" && Object.hasOwn(RETIRED_SCHEDULE_FORMATS, format) ? (RETIRED_SCHEDULE_FORMATS[format] ?? null) : null;
}

function fail(issues: IssueCollector): Extract<ParseScheduleResult, { ok: false }> {
  const list = [...issues.issues];
  if (issues.dropped > 0) list.push({ path: "", message: `${issues.dropped} more issues not listed` });
  if (list.length === 0) list.push({ path: "", message: "the schedule is not valid" });
  return { ok: false, issues: list, unlistedCount: issues.dropped };
}
