import type { RotationResult } from "@/lib/engine/model";

import { formatNumber } from "./format";

export type MemberRotationsProps = { rotations: RotationResult[] };

/** Rotation at every node per combination, in milliradians (the engine works in radians). */
export function MemberRotations({ rotations }: MemberRotationsProps) {
  if (rotations.length === 0) return <p className="text-ink-soft">No rotations were recorded.</p>;
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet">
      <table className="w-full border-collapse text-left">
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className="px-3 py-2 font-medium">Combination</th>
            <th scope="col" className="px-3 py-2 text-right font-medium">Node</th>
            <th scope="col" className="px-3 py-2 text-right font-medium">At x (m)</th>
            <th scope="col" className="px-3 py-2 text-right font-medium">Rotation (mrad)</th>
          </tr>
        </thead>
        <tbody>
          {rotations.map((r) => (
            <tr key={`${r.combinationId}-${r.nodeIndex}`} className="border-t border-rule">
              <td className="px-3 py-1.5 [overflow-wrap:anywhere]">{r.combinationId}</td>
              <td className="px-3 py-1.5 text-right">{r.nodeIndex + 1}</td>
              <td className="px-3 py-1.5 text-right">{formatNumber(r.atMm / 1000, 3)}</td>
              <td className="px-3 py-1.5 text-right">{formatNumber(r.rotationRad * 1000, 3)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
