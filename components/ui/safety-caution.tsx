import { SAFETY_CAUTION } from "@/lib/safety";

export function SafetyCaution() {
  return (
    <aside
      aria-label="Safety caution"
      className="rounded border border-caution/30 bg-caution-bg px-3 py-2 text-xs leading-relaxed text-caution"
    >
      <strong className="font-semibold">Caution.</strong> {SAFETY_CAUTION}
    </aside>
  );
}
