import type { Metadata } from "next";

import { SafetyCaution } from "@/components/ui/safety-caution";
import { requirePage } from "@/lib/server/auth/guards";
import { CASE_E_MPA, CASE_I_MM4, runClosedFormCases } from "@/lib/verification/closed-form-cases";

import { PageHeader } from "../_components/page-header";

export const metadata: Metadata = { title: "Engine verification" };

function formatValue(value: number, unit: "mm" | "rad"): string {
  return unit === "mm" ? `${value.toFixed(4)} mm` : `${(value * 1000).toFixed(5)} mrad`;
}

/** The closed-form cases, run through the engine on every visit, beside their formulas and sources. */
export default async function VerificationPage() {
  await requirePage("/verification");
  const cases = runClosedFormCases();
  return (
    <>
      <PageHeader
        title="Engine verification"
        lead={`Handbook cases run through Sagline's solver now, on a 6 m member with E = ${CASE_E_MPA.toLocaleString("en")} MPa and I = ${CASE_I_MM4.toExponential(1)} mm⁴ (w = 10 kN/m, P = 20 kN). The engine promises a relative error of at most 1e-9.`}
      />
      <SafetyCaution />
      <div className="mt-4 overflow-x-auto rounded border border-rule bg-sheet">
        <table className="w-full border-collapse text-left">
          <thead className="text-xs uppercase tracking-wide text-ink-soft">
            <tr>
              <th className="px-3 py-2 font-medium">Case</th>
              <th className="px-3 py-2 font-medium">Formula</th>
              <th className="px-3 py-2 text-right font-medium">Expected</th>
              <th className="px-3 py-2 text-right font-medium">Engine</th>
              <th className="px-3 py-2 text-right font-medium">Relative error</th>
              <th className="px-3 py-2 font-medium">Source</th>
            </tr>
          </thead>
          <tbody>
            {cases.map((c) => (
              <tr key={c.id} className="border-t border-rule align-top">
                <td className="px-3 py-2">
                  <span className="font-medium">{c.title}</span>
                  <span className="block text-xs text-ink-soft">{c.quantity}</span>
                </td>
                <td className="px-3 py-2 font-mono text-xs">{c.formula}</td>
                <td className="px-3 py-2 text-right">{formatValue(c.expected, c.unit)}</td>
                <td className="px-3 py-2 text-right">{formatValue(c.computed, c.unit)}</td>
                <td className={`px-3 py-2 text-right ${c.relativeError <= 1e-9 ? "text-pass" : "font-semibold text-fail"}`}>
                  {c.relativeError.toExponential(1)} {c.relativeError <= 1e-9 ? "✓ within 1e-9" : "✗ beyond 1e-9"}
                </td>
                <td className="px-3 py-2 text-xs text-ink-soft">{c.source}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-3 text-xs text-ink-soft">
        The same cases, and many more (overhangs, partial and varying loads, moments, continuous spans, springs, shear
        deformation, property tests and an independent cross-check), run in the test suite under tests/unit/lib/engine.
      </p>
    </>
  );
}
