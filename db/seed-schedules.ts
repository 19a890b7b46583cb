// The demo's checked schedules: two submissions of one invented schedule reference, checked by the
// real engine through the workers' own code path, with dispositions recorded on the first.
import { demoOrganizations, demoProject, demoScheduleReference } from "./seed-data";
import { recordDisposition } from "@/lib/server/review/record-disposition";
import { SCHEDULE_FORMAT } from "@/lib/vocabulary";
import { checkChunk } from "@/lib/server/schedules/check-chunk";
import { submitSchedule } from "@/lib/server/schedules/submit-schedule";

/** An invented welded steel mezzanine beam; spans in metres, line loads in kN/m. */
function mezzanineBeam(mark: string, spanM: number, liveKnPerM: number, depthMm = 300) {
  return {
    mark,
    category: "floor_beam",
    quantity: 2,
    material: "steel-s355",
    section: { shape: "i_plate", bf: 150, tf: 10.7, d: depthMm, tw: 7.1 },
    spans: [spanM],
    supports: ["pinned", "roller"],
    selfWeight: true,
    loads: [
      { case: "dead", type: "uniform", w: 3 },
      { case: "live", type: "uniform", w: liveKnPerM },
    ],
  };
}

function scheduleDoc(revision: string, members: unknown[]) {
  return {
    format: SCHEDULE_FORMAT,
    name: `${demoProject.name}: mezzanine beams, rev ${revision}`,
    reference: demoScheduleReference,
    notes: "Invented example for the demo: the firms, people, project and drawings do not exist.",
    units: { system: "SI", length: "m", sectionDimension: "mm", distributedLoad: "kN/m", force: "kN" },
    profile: { preset: "ibc-2021-floor" },
    members,
  };
}

async function submitAndCheck(doc: unknown): Promise<string> {
  const submitted = await submitSchedule({ organizationId: demoOrganizations.engineering.id, source: "api-json", doc, projectId: demoProject.id, submittedByUserId: "usr_demosubmitter" });
  // The same function the workers run; a worker that picks the queued chunk later skips it as done.
  for (let chunk = 0; chunk * 2000 < submitted.memberCount; chunk++) await checkChunk(submitted.id, chunk);
  return submitted.id;
}

const engineer = { kind: "user" as const, userId: "usr_demoengineer", name: "Tomasz Achebe" };

/** Rev A: checked, its failures dispositioned. Rev B: checked, awaiting review; MB2 is unchanged, so rev A's decision shows as carried over. */
export async function seedCheckedSchedules(): Promise<{ revA: string; revB: string }> {
  const revA = await submitAndCheck(scheduleDoc("A", [mezzanineBeam("MB1", 6, 7.5), mezzanineBeam("MB2", 9, 12), mezzanineBeam("MB3", 10, 15), mezzanineBeam("MB4", 5, 5)]));
  const organizationId = demoOrganizations.engineering.id;
  await recordDisposition(
    organizationId,
    revA,
    "MB2",
    {
      kind: "accepted_with_justification",
      justification: "Invented demo note: a prop at midspan under the stair landing (sketch SK-07, also invented) halves the span; the propped case was checked by hand.",
    },
    engineer,
  );
  await recordDisposition(organizationId, revA, "MB3", { kind: "member_to_be_revised", justification: "Deepen the section or add a prop; resubmit with rev B." }, engineer);
  const revB = await submitAndCheck(
    scheduleDoc("B", [mezzanineBeam("MB1", 6, 7.5), mezzanineBeam("MB2", 9, 12), mezzanineBeam("MB3", 10, 15, 400), mezzanineBeam("MB4", 5, 5), mezzanineBeam("MB5", 8, 14)]),
  );
  return { revA, revB };
}
