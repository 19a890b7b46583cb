import { checkMember } from "@/lib/engine/check-member";
import { parseSchedule } from "@/lib/engine/intake";
import type { RotationResult, ShapeSample } from "@/lib/engine/model";

export interface MemberDiagrams {
  shape: ShapeSample[];
  rotations: RotationResult[];
}

/**
 * Re-runs the engine for one stored member for what only its own page needs: the sampled shape
 * and the support rotations. Cheap for one member; storing them for every member of a 100,000-
 * member schedule is not.
 */
export function computeMemberDiagrams(header: Record<string, unknown>, input: unknown): MemberDiagrams {
  const parsed = parseSchedule({ ...header, members: [input] });
  if (!parsed.ok) return { shape: [], rotations: [] };
  try {
    const result = checkMember(parsed.schedule.members[0]!, parsed.schedule.profile);
    return { shape: result.shape, rotations: result.rotations };
  } catch {
    return { shape: [], rotations: [] };
  }
}
