import type { MemberReport } from "@/lib/server/schedules/get-member-report";
import { formatQuantity, formatSignificant, type DisplayUnits } from "./display-units";
import { formatNumber, splitPowerOfTen } from "./format";
import { OutcomeLabel } from "./outcome-label";

function PowerOfTen({ value }: { value: number }) {
  const split = splitPowerOfTen(value);
  if (!split) return <>—</>;
  return (
    <>
      {split.mantissa} × 10<sup>{split.exponent}</sup>
    </>
  );
}

export type MemberSuggestionProps = {
  status: "pass" | "fail" | "error" | "pending";
  suggestion: MemberReport["suggestion"];
  units: DisplayUnits;
  /** The largest I the member has now, mm^4, to say how much stiffer it must get. */
  currentIMm4?: number | null;
};

export function MemberSuggestion({ status, suggestion, units, currentIMm4 = null }: MemberSuggestionProps) {
  return (
    <section aria-labelledby="suggestion-heading" className="rounded border border-rule bg-sheet p-4">
      <h2 id="suggestion-heading" className="mb-2 font-semibold">
        To pass
      </h2>
      {status === "pass" ? (
        <p>Every check passes; no stiffer section is needed.</p>
      ) : suggestion ? (
        <dl className="space-y-2">
          <div>
            <dt className="text-xs font-medium uppercase tracking-wide text-ink-soft">Minimum second moment of area</dt>
            <dd data-testid="minimum-i">
              {suggestion.minIMm4 === null ? (
                <>No I alone makes this member pass: springs, shear deflection or the frequency limit govern whatever the I (see the remarks).</>
              ) : (
                <>
                  <PowerOfTen value={suggestion.minIMm4} /> mm<sup>4</sup>
                  {units.secondMoment !== "mm^4" ? <> = {formatQuantity(suggestion.minIMm4, "secondMoment", units)}</> : null}
                  {currentIMm4 !== null && currentIMm4 > 0 ? <> ({formatSignificant(suggestion.minIMm4 / currentIMm4, 3)} × the member&apos;s own I)</> : null}{" "}
                  <span className="block text-xs text-ink-soft">(the same in every span, rechecked with springs, creep, shear and frequency; E, area, self-weight and supports held at the member's own)</span>
                </>
              )}
            </dd>
          </div>
          <div>
            <dt className="text-xs font-medium uppercase tracking-wide text-ink-soft">Lightest catalogue section that passes</dt>
            <dd className="[overflow-wrap:anywhere]" data-testid="catalogue-suggestion">
              {suggestion.sectionName ?? "None on record: no section catalogue was available when this member was checked, or no section in it passes."}
            </dd>
          </div>
        </dl>
      ) : (
        <p className="text-ink-soft">No suggestion is available for this member.</p>
      )}
    </section>
  );
}

export type MemberFrequencyProps = { frequency: MemberReport["frequency"] };

export function MemberFrequency({ frequency }: MemberFrequencyProps) {
  return (
    <section aria-labelledby="frequency-heading" className="rounded border border-rule bg-sheet p-4">
      <h2 id="frequency-heading" className="mb-2 font-semibold">
        First natural frequency
      </h2>
      {frequency ? (
        <p>
          {formatNumber(frequency.hz)} Hz against a minimum of {formatNumber(frequency.minHz)} Hz ({frequency.method === "exact" ? "exact solution" : frequency.method === "finite_element" ? "converged finite-element eigenvalue" : "Rayleigh estimate"}){" "}
          <OutcomeLabel status={frequency.pass ? "pass" : "fail"} />
        </p>
      ) : (
        <p className="text-ink-soft">The limit profile does not ask for a frequency check.</p>
      )}
    </section>
  );
}
