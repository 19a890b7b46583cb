import type { CombinationUsed, CreepSource, MemberModelView } from "@/lib/server/schedules/describe-member-model";

import { formatQuantity, formatSignificant, type DisplayUnits } from "./display-units";
import { formatSpanRatio } from "./format";

export type MemberUsedProps = { model: MemberModelView; units: DisplayUnits };

/** "1 × dead + 1 × live" from a factor table (cases with factor 0 left out). */
function describeFactors(factors: Record<string, number> | null): string {
  if (factors === null) return "";
  const terms = Object.entries(factors).filter(([, factor]) => factor !== 0);
  return terms.length === 0 ? "none" : terms.map(([loadCase, factor]) => `${formatSignificant(factor)} × ${loadCase}`).join(" + ");
}

const CREEP_SOURCE_WORDS: Record<CreepSource, string> = {
  material: "the member's material and creep method",
  ibc_creep_component: "IBC 2021 Table 1604.3 creep component for this material",
  fixed: "a fixed number in the limit profile",
  none: "no long-term part",
};

function describeCreep(combination: CombinationUsed): string {
  if (combination.creepSource === "none" || combination.sustainedFactors === null) return "none";
  return `${formatSignificant(combination.creepFactor)} × (${describeFactors(combination.sustainedFactors)}), from ${CREEP_SOURCE_WORDS[combination.creepSource]}`;
}

function describeLimit(combination: CombinationUsed, model: MemberModelView, units: DisplayUnits): string {
  const parts = [`${formatSpanRatio(combination.limitRatio)} of the span`];
  parts.push(
    combination.cantileverLimitRatio !== null
      ? `cantilevers ${formatSpanRatio(combination.cantileverLimitRatio)} of their own length`
      : `cantilevers on ${formatSignificant(model.profile.cantileverSpanMultiplier)} × their length`,
  );
  if (combination.capMm !== null) parts.push(`capped at ${formatQuantity(combination.capMm, "deflection", units)}`);
  return parts.join("; ");
}

const th = "px-2 py-1.5 text-left align-bottom text-xs font-medium text-ink-soft";
const td = "px-2 py-1.5 align-top";

/** The combinations, creep factors and section and material values the engine checked this member with. */
export function MemberUsed({ model, units }: MemberUsedProps) {
  const anyCracked = model.spans.some((span) => span.crackedConcrete);
  return (
    <div className="space-y-4">
      <p>
        Limit profile <strong className="font-semibold">{model.profile.label}</strong> ({model.profile.source}).{" "}
        {model.profile.patternLoads ? "Variable loads are placed span by span in the worst arrangement for each check." : "Every load is present everywhere at once (pattern loading off)."}
      </p>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <caption className="mb-1 text-left text-sm font-medium">Combinations</caption>
          <thead>
            <tr className="border-b border-rule">
              <th scope="col" className={th}>Combination</th>
              <th scope="col" className={th}>Immediate factors</th>
              <th scope="col" className={th}>Long-term (creep) part</th>
              <th scope="col" className={th}>Limit</th>
            </tr>
          </thead>
          <tbody>
            {model.combinations.map((combination) => (
              <tr key={combination.id} className="border-t border-rule">
                <th scope="row" className={`${td} text-left font-medium [overflow-wrap:anywhere]`}>
                  {combination.label}
                  <span className="block text-xs font-normal text-ink-soft">{combination.id}</span>
                </th>
                <td className={td}>{describeFactors(combination.factors)}</td>
                <td className={td}>{describeCreep(combination)}</td>
                <td className={td}>{describeLimit(combination, model, units)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-sm">
          <caption className="mb-1 text-left text-sm font-medium">Spans as analysed (overhangs are spans of their own)</caption>
          <thead>
            <tr className="border-b border-rule">
              <th scope="col" className={th}>Span</th>
              <th scope="col" className={`${th} text-right`}>Length</th>
              <th scope="col" className={th}>Judged as</th>
              <th scope="col" className={`${th} text-right`}>E</th>
              <th scope="col" className={`${th} text-right`}>{anyCracked ? "I (gross)" : "I"}</th>
              <th scope="col" className={`${th} text-right`}>A</th>
            </tr>
          </thead>
          <tbody>
            {model.spans.map((span, index) => (
              <tr key={index} className="border-t border-rule">
                <th scope="row" className={`${td} text-left font-medium`}>{index + 1}</th>
                <td className={`${td} text-right whitespace-nowrap`}>{formatQuantity(span.lengthMm, "length", units)}</td>
                <td className={td}>
                  {span.kind === "cantilever" ? "overhang (cantilever)" : "span"}, limit on {formatQuantity(span.judgedLengthMm, "length", units)}
                  {span.crackedConcrete ? <span className="block text-xs text-ink-soft">cracked: the checks use I_e under each load level</span> : null}
                </td>
                <td className={`${td} text-right whitespace-nowrap`}>{formatQuantity(span.eMpa, "modulus", units)}</td>
                <td className={`${td} text-right whitespace-nowrap`}>{formatQuantity(span.iMm4, "secondMoment", units)}</td>
                <td className={`${td} text-right whitespace-nowrap`}>{formatQuantity(span.areaMm2, "area", units)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="text-ink-soft">
        Section {model.sectionName ?? "—"}, material {model.materialName ?? "—"}. Self-weight {model.selfWeightCase ? `added to the ${model.selfWeightCase} case` : "not added"}; shear deformation{" "}
        {model.shearDeformation ? "included" : "not included"}.
      </p>
    </div>
  );
}
