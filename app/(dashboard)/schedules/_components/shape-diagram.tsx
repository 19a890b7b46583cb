import type { ShapeSample } from "@/lib/engine/model";
import type { MemberModelView } from "@/lib/server/schedules/describe-member-model";
import type { MemberCheckRow } from "@/lib/server/schedules/get-member-report";

import { DeflectionPanel } from "./deflection-panel";
import { createXScale } from "./diagram-scale";
import type { DisplayUnits } from "./display-units";
import { MemberSketch } from "./member-sketch";

export type ShapeDiagramProps = {
  shape: ShapeSample[];
  model: MemberModelView | null;
  checks: MemberCheckRow[];
  units: DisplayUnits;
  /** Prefix for the SVG title ids, unique on the page (the record and a what-if both draw one). */
  idPrefix?: string;
};

function Key() {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-xs" aria-label="How to read the diagrams">
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" width="30" height="10" viewBox="0 0 30 10">
          <line x1="0" x2="30" y1="5" y2="5" stroke="var(--color-action)" strokeWidth="2.2" />
        </svg>
        deflected shape, every load in place
      </li>
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" width="30" height="10" viewBox="0 0 30 10">
          <line x1="0" x2="30" y1="5" y2="5" stroke="currentColor" strokeWidth="1.4" strokeDasharray="6 4" />
        </svg>
        allowed deflection of the span
      </li>
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12">
          <circle cx="6" cy="6" r="4" fill="none" stroke="currentColor" strokeWidth="1.6" />
        </svg>
        largest deflection of a span that passes
      </li>
      <li className="flex items-center gap-1.5">
        <svg aria-hidden="true" width="12" height="12" viewBox="0 0 12 12">
          <path d="M6 1.5l5 9H1z" fill="currentColor" />
        </svg>
        largest deflection of a span that fails (&ldquo;over&rdquo;)
      </li>
    </ul>
  );
}

/**
 * The member's diagrams: the member with its supports and loads, then one panel per combination
 * with its deflected shape, each span's allowed deflection and each check's maximum. Server
 * rendered SVG in ink and one accent, readable in print; each panel is described in text.
 */
export function ShapeDiagram({ shape, model, checks, units, idPrefix = "diagram" }: ShapeDiagramProps) {
  const samples = shape.filter((s) => Number.isFinite(s.xMm));
  if (model === null || samples.length < 2 || model.spans.length === 0) {
    return <p className="text-ink-soft">No deflected shape was sampled for this member.</p>;
  }
  const last = model.spans[model.spans.length - 1]!;
  const scale = createXScale(0, last.startMm + last.lengthMm);
  const patterned = checks.some((c) => c.loadedSpans !== undefined);
  return (
    <figure className="space-y-3">
      <Key />
      <MemberSketch model={model} scale={scale} units={units} id={`${idPrefix}-member`} />
      {model.combinations.map((combination, index) => (
        <DeflectionPanel
          key={combination.id}
          id={`${idPrefix}-c${index}`}
          title={combination.label}
          combinationId={combination.id}
          samples={samples}
          checks={checks.filter((c) => c.combinationId === combination.id)}
          spans={model.spans}
          supports={model.supports}
          scale={scale}
          units={units}
        />
      ))}
      <figcaption className="text-xs text-ink-soft">
        Deflection is drawn downward as the member sags, measured from its undeflected line.
        {patterned ? " A marked maximum comes from the worst arrangement of the variable loads, so it can lie beyond the curve, which has every load in place." : ""}
      </figcaption>
    </figure>
  );
}
