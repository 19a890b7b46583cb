import { checkMember } from "@/lib/engine/check-member";
import { parseSchedule } from "@/lib/engine/intake";
import type { ShapeSample } from "@/lib/engine/model";

/** Re-runs the engine for one stored member to sample its deflected shape for a diagram. */
export function computeMemberShape(header: Record<string, unknown>, input: unknown): ShapeSample[] {
  const parsed = parseSchedule({ ...header, members: [input] });
  if (!parsed.ok) return [];
  try {
    return checkMember(parsed.schedule.members[0]!, parsed.schedule.profile).shape;
  } catch {
    return [];
  }
}
