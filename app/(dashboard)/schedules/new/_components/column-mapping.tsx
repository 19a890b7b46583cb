"use client";

import type { UnitSystem } from "@/lib/engine/units";
import { listAcceptedUnits } from "@/lib/engine/units";

import { IGNORE, describeDefaultUnit, getColumnKind, type ColumnChoices, type HeaderInfo } from "./csv-model";

export type ColumnMappingProps = {
  headers: HeaderInfo[];
  choices: ColumnChoices;
  targetGroups: { group: string; names: string[] }[];
  onTarget: (index: number, target: string) => void;
  onUnit: (index: number, unit: string) => void;
  system: UnitSystem | null;
};

const selectClass = "w-full max-w-[16rem] rounded border border-rule bg-sheet px-2 py-1 text-sm aria-[invalid]:border-fail";

/** One line per column of the file: which Sagline column it is, and its unit when it holds a quantity. */
export function ColumnMapping({ headers, choices, targetGroups, onTarget, onUnit, system }: ColumnMappingProps) {
  return (
    <div className="overflow-x-auto rounded border border-rule bg-sheet">
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Column mapping</caption>
        <thead className="text-xs uppercase tracking-wide text-ink-soft">
          <tr className="border-b border-rule">
            <th scope="col" className="px-3 py-2 font-medium">Your column</th>
            <th scope="col" className="px-3 py-2 font-medium">Sagline column</th>
            <th scope="col" className="px-3 py-2 font-medium">Unit</th>
          </tr>
        </thead>
        <tbody>
          {headers.map((h) => {
            const target = h.knownName ?? choices.targets[h.index] ?? "";
            const kind = target && target !== IGNORE ? getColumnKind(target) : null;
            const label = h.original === "" ? `column ${h.index + 1} (no header)` : h.original;
            return (
              <tr key={h.index} className="border-t border-rule align-top" data-column={h.original}>
                <th scope="row" className="max-w-[16rem] px-3 py-1.5 font-medium [overflow-wrap:anywhere]">
                  {label}
                </th>
                <td className="px-3 py-1.5">
                  {h.knownName ? (
                    <span>
                      {h.knownName} <span className="text-xs text-ink-soft">(recognised)</span>
                    </span>
                  ) : (
                    <select
                      aria-label={`Sagline column for ${label}`}
                      value={target}
                      aria-invalid={target === "" ? true : undefined}
                      onChange={(e) => onTarget(h.index, e.currentTarget.value)}
                      className={selectClass}
                    >
                      <option value="">Choose…</option>
                      <option value={IGNORE}>Ignore this column</option>
                      {targetGroups.map((g) => (
                        <optgroup key={g.group} label={g.group}>
                          {g.names.map((n) => (
                            <option key={n} value={n}>
                              {n}
                            </option>
                          ))}
                        </optgroup>
                      ))}
                    </select>
                  )}
                </td>
                <td className="px-3 py-1.5">
                  {!kind ? (
                    <span className="text-ink-soft">{target === IGNORE ? "ignored" : h.headerUnit ? `[${h.headerUnit}] (this column takes no unit)` : "—"}</span>
                  ) : h.headerUnit ? (
                    <span>
                      {h.headerUnit} <span className="text-xs text-ink-soft">(from the header)</span>
                    </span>
                  ) : (
                    <select aria-label={`Unit for ${label}`} value={choices.units[h.index] ?? ""} onChange={(e) => onUnit(h.index, e.currentTarget.value)} className={selectClass}>
                      <option value="">{describeDefaultUnit(kind, system)}</option>
                      {listAcceptedUnits(kind).map((u) => (
                        <option key={u} value={u}>
                          {u}
                        </option>
                      ))}
                    </select>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
