import type { Metadata } from "next";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { requirePage } from "@/lib/server/auth/guards";
import type { CaseUnit, VerifiedCase } from "@/lib/verification/closed-form-cases";
import { runVerificationGroups, type VerifiedGroup } from "@/lib/verification";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Engine verification" };

function formatValue(value: number, unit: CaseUnit): string {
  if (!Number.isFinite(value)) return "—";
  switch (unit) {
    case "mm":
      return `${value.toFixed(4)} mm`;
    case "rad":
      return `${(value * 1000).toFixed(5)} mrad`;
    case "mm^2":
      return `${value.toLocaleString("en", { minimumFractionDigits: 1, maximumFractionDigits: 1 })} mm²`;
    case "mm^4":
      return `${value.toExponential(4)} mm⁴`;
    case "kg/m^3":
      return `${value.toLocaleString("en", { maximumFractionDigits: 1 })} kg/m³`;
    case "MPa":
      return `${value.toLocaleString("en", { maximumFractionDigits: 1 })} MPa`;
    case "Hz":
      return `${value.toFixed(3)} Hz`;
    case "N*mm":
      return `${(value / 1e6).toFixed(4)} kN·m`;
    case "ratio":
      return value.toFixed(6);
  }
}

function CaseRow({ c }: { c: VerifiedCase }) {
  const tolerance = c.allowedRelativeError.toExponential(0);
  return (
    <tr className="border-t border-rule align-top">
      <td className="px-3 py-2">
        <span className="font-medium">{c.title}</span>
        <span className="block text-xs text-ink-soft">{c.quantity}</span>
      </td>
      <td className="px-3 py-2 font-mono text-xs">{c.formula}</td>
      <td className="px-3 py-2 text-right">{formatValue(c.expected, c.unit)}</td>
      <td className="px-3 py-2 text-right">{formatValue(c.computed, c.unit)}</td>
      <td className={`px-3 py-2 text-right ${c.withinTolerance ? "text-pass" : "font-semibold text-fail"}`}>
        {c.relativeError.toExponential(1)} {c.withinTolerance ? `✓ within ${tolerance}` : `✗ beyond ${tolerance}`}
      </td>
      <td className="px-3 py-2 text-xs text-ink-soft">{c.source}</td>
    </tr>
  );
}

function GroupSection({ group }: { group: VerifiedGroup }) {
  const headingId = `verification-${group.id}`;
  return (
    <section aria-labelledby={headingId} className="mt-6">
      <h2 id={headingId} className="text-lg font-semibold">
        {group.title}
      </h2>
      {group.description ? <p className="mt-1 text-sm text-ink-soft">{group.description}</p> : null}
      <div className="mt-2 overflow-x-auto rounded border border-rule bg-sheet">
        <table className="w-full border-collapse text-left">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="px-3 py-2 font-medium">Case</th>
              <th className="px-3 py-2 font-medium">Formula</th>
              <th className="px-3 py-2 text-right font-medium">Reference</th>
              <th className="px-3 py-2 text-right font-medium">Engine</th>
              <th className="px-3 py-2 text-right font-medium">Relative error</th>
              <th className="px-3 py-2 font-medium">Source</th>
            </tr>
          </thead>
          <tbody>
            {group.cases.map((c) => (
              <CaseRow key={c.id} c={c} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}

/** Every verification group (lib/verification), run through the engine on every visit, beside its formulas and sources. */
export default async function VerificationPage() {
  await requirePage("/verification");
  const groups = runVerificationGroups();
  return (
    <>
      <PageHeader
        title="Engine verification"
        lead="Each rule the engine applies, computed by Sagline now beside the reference value from its published source. Closed-form cases are held to a relative error of 1e-9 unless a case names its own tolerance."
      />
      <SafetyCaution />
      {groups.map((group) => (
        <GroupSection key={group.id} group={group} />
      ))}
      <p className="mt-3 text-xs text-ink-soft">
        The same cases, and many more (overhangs, partial and varying loads, moments, continuous spans, springs, shear
        deformation, property tests and an independent cross-check), run in the test suite under tests/unit/lib/engine.
        Sources marked “from memory” were recalled from the named publication: check them against it.
      </p>
    </>
  );
}
