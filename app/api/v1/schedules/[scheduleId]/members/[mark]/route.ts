import { withApiKey } from "@/app/api/v1/_lib/with-api-key";
import { getMemberResult, getSchedule } from "@/db/queries/schedules";
import { assertFound } from "@/lib/server/errors";
import { SAFETY_CAUTION } from "@/lib/safety";
import { computeMemberDiagrams } from "@/lib/server/schedules/member-shape";

// GET /api/v1/schedules/{scheduleId}/members/{mark}: inputs, every check and the diagram samples of one member.
export const GET = withApiKey<{ scheduleId: string; mark: string }>("results:read", async (_request, key, params) => {
  const schedule = assertFound(await getSchedule(key.organizationId, params.scheduleId), "The schedule");
  const found = assertFound(await getMemberResult(schedule.id, decodeURIComponent(params.mark)), "The member");
  const { member, checks } = found;
  const detail = (member.detail ?? null) as { frequency: unknown; suggestion: unknown; error: string | null } | null;
  const diagrams = detail && !detail.error ? computeMemberDiagrams(member.header as Record<string, unknown>, member.input) : { shape: [], rotations: [] };
  return Response.json({
    schedule: { id: schedule.id, status: schedule.status },
    mark: member.mark,
    category: member.category,
    input: member.input,
    status: detail === null ? "pending" : detail.error ? "error" : member.pass ? "pass" : "fail",
    error: detail?.error ?? null,
    governingCheck: member.governing_check ?? null,
    utilization: member.utilization ?? null,
    factorOfSafety: member.factor_of_safety ?? null,
    checks: checks.map((c) => ({
      check: c.check_key,
      combination: c.combination_id,
      spanIndex: c.span_index,
      spanKind: c.span_kind,
      deflectionMm: c.deflection_mm,
      atMm: c.at_mm,
      allowedMm: c.allowed_mm,
      utilization: c.utilization,
      factorOfSafety: c.factor_of_safety,
      pass: c.pass,
    })),
    rotations: diagrams.rotations,
    frequency: detail?.frequency ?? null,
    suggestion: detail?.suggestion ?? null,
    shape: diagrams.shape,
    units: { length: "mm", rotation: "rad", frequency: "Hz" },
    caution: SAFETY_CAUTION,
  });
});
