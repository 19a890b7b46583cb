/**
 * Parses a public schedule and checks every member: the one call the API, worker and CLI share.
 * Internal units throughout (model.ts); the results carry the schedule's profile.
 */
import { checkMember } from "./check-member";
import { parseSchedule, type ParsedSchedule, type ParseScheduleOptions } from "./intake";
import type { CatalogueSection, InputIssue, LimitProfile, Member, MemberResult, ReinforcedConcreteSection } from "./model";
import { EngineInputError } from "./solver/engine-input-error";
import type { MemberOrigins } from "./intake";
import { REINFORCEMENT_PUBLIC_FIELDS } from "./intake/read-reinforcement";

export interface CheckScheduleOptions extends ParseScheduleOptions {
  /** Used both to resolve `section: "name"` and for the lightest-passing-section suggestion. */
  catalogue?: CatalogueSection[];
}

export interface ScheduleSummary {
  members: number;
  passed: number;
  failed: number;
}

export type CheckScheduleResult =
  | { ok: true; schedule: ParsedSchedule; results: MemberResult[]; summary: ScheduleSummary }
  | { ok: false; issues: InputIssue[] };

type CheckMemberFn = (member: Member, profile: LimitProfile, catalogue?: CatalogueSection[]) => MemberResult;

/**
 * Runs checkMember over parsed members. An EngineInputError from one member becomes issues under
 * that member's path (`members[3].spans[0]...`); every member is tried so all issues come at once.
 * Any other error is a defect and propagates.
 */
export function checkParsedSchedule(schedule: ParsedSchedule, catalogue: CatalogueSection[] | undefined, check: CheckMemberFn = checkMember): CheckScheduleResult {
  const results: MemberResult[] = [];
  const issues: InputIssue[] = [];
  schedule.members.forEach((member, index) => {
    try {
      results.push(check(member, schedule.profile, catalogue));
    } catch (error) {
      if (!(error instanceof EngineInputError)) throw error;
      issues.push(...error.issues.map((issue) => ({ path: mapEnginePath(issue.path, `members[${index}]`, schedule.origins[index]), message: issue.message })));
    }
  });
  if (issues.length > 0) {
    // Profile and catalogue issues repeat for every member: list each once.
    const seen = new Set<string>();
    const unique = issues.filter((issue) => {
      const key = `${issue.path}\n${issue.message}`;
      return seen.has(key) ? false : (seen.add(key), true);
    });
    return { ok: false, issues: unique };
  }
  const passed = results.filter((r) => r.pass).length;
  return { ok: true, schedule, results, summary: { members: results.length, passed, failed: results.length - passed } };
}

/**
 * Engine paths address the engine model (`spans[1].eMpa`, where a left overhang is span 0, or
 * `profile.combinations[0]`); put them back on the public field they came from.
 */
export function mapEnginePath(enginePath: string, memberPath: string, origins: MemberOrigins | undefined): string {
  if (enginePath.startsWith("profile")) return enginePath;
  if (enginePath.startsWith("catalogue")) return enginePath;
  const indexed = /^(spans|supports)\[(\d+)\](.*)$/.exec(enginePath);
  const reinforced = /^spans\[(\d+)\]\.reinforcedConcrete\.(\w+)$/.exec(enginePath);
  const reinforcement = reinforced ? origins?.reinforcements?.[Number(reinforced[1])] : undefined;
  const publicField = reinforced ? REINFORCEMENT_PUBLIC_FIELDS[reinforced[2] as keyof ReinforcedConcreteSection] : undefined;
  if (reinforcement && publicField) return `${reinforcement}.${publicField}`;
  const origin = indexed && origins ? origins[indexed[1] as "spans" | "supports"][Number(indexed[2])] : undefined;
  if (indexed && origin) return `${origin}${indexed[3] ? ` (engine ${indexed[1]}[${indexed[2]}]${indexed[3]})` : ""}`;
  if (enginePath === "") return memberPath;
  return enginePath.startsWith("[") ? `${memberPath}${enginePath}` : `${memberPath}.${enginePath}`;
}

/** parseSchedule, then checkMember per member; input problems come back as issues, never thrown. */
export function checkSchedule(doc: unknown, options: CheckScheduleOptions = {}): CheckScheduleResult {
  const parsed = parseSchedule(doc, options);
  if (!parsed.ok) return parsed;
  return checkParsedSchedule(parsed.schedule, options.catalogue);
}
