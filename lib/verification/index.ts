/**
 * Every group of verification cases, in the order the /verification page shows them and the unit
 * test (tests/unit/lib/verification/index.test.ts) runs them. To add a group: one import and one
 * entry below; the page and the test pick it up from here.
 */
import { CASE_E_MPA, CASE_I_MM4, closedFormCases, runCases, type ClosedFormCase, type VerifiedCase } from "./closed-form-cases";
import { concreteCases } from "./concrete-cases";
import { crackedMemberCases } from "./cracked-member-cases";
import { frequencyCases } from "./frequency-cases";
import { patternCases } from "./pattern-cases";
import { presetCases } from "./preset-cases";
import { sectionMaterialCases } from "./section-material-cases";

export interface VerificationGroup {
  id: string;
  title: string;
  /** What the group's cases share (member, loads), shown under the title. */
  description?: string;
  cases: ClosedFormCase[];
}

export const VERIFICATION_GROUPS: VerificationGroup[] = [
  {
    id: "closed-form",
    title: "Closed-form beam deflections and rotations",
    description: `Handbook cases on a 6 m member with E = ${CASE_E_MPA.toLocaleString("en")} MPa and I = ${CASE_I_MM4.toExponential(1)} mm⁴ (w = 10 kN/m, P = 20 kN), solved by Sagline's solver.`,
    cases: closedFormCases,
  },
  {
    id: "sections-materials",
    title: "Section shear areas and timber densities",
    description: "The shear areas that shear deformation uses and the EN 338 mean densities that self-weight and frequency use, read from the libraries schedules use.",
    cases: sectionMaterialCases,
  },
  {
    id: "presets",
    title: "Limit profiles and the clauses they cite",
    description: "Each preset's combinations, cantilever rule, creep component and limit ratio against the deflection the cited clause asks for, written out from the handbook formulas.",
    cases: presetCases,
  },
  {
    id: "pattern",
    title: "Pattern (partial) live load",
    description: "Variable loads placed span by span in the worst arrangement for each check, against the handbook cases for partly loaded continuous beams and overhangs.",
    cases: patternCases,
  },
  {
    id: "frequency",
    title: "First natural frequency and the minimum stiffness",
    description: "Converged finite-element eigenvalues against published frequency coefficients, and the minimum I that a failing member needs against its closed form.",
    cases: frequencyCases,
  },
  {
    id: "concrete",
    title: "Reinforced concrete: cracked section and effective I",
    description: "I_cr, M_cr and I_e (ACI 318-19 24.2.3) and the resulting deflections of one rectangular beam, against the formulas written out independently.",
    cases: concreteCases,
  },
  {
    id: "concrete-members",
    title: "Reinforced concrete members: patterns, springs and top steel",
    description: "A cracked span with an overhang under pattern live load, the same member on a spring judged from the chord, and the cracked section under hogging with top steel, against the formulas written out independently.",
    cases: crackedMemberCases,
  },
];

export interface VerifiedGroup extends Omit<VerificationGroup, "cases"> {
  cases: VerifiedCase[];
}

/** Runs every group's cases through the engine now. */
export function runVerificationGroups(groups: readonly VerificationGroup[] = VERIFICATION_GROUPS): VerifiedGroup[] {
  return groups.map((group) => ({ ...group, cases: runCases(group.cases) }));
}
