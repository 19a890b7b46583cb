import { roles, type Role } from "@/db/schema";
import { roleDescriptions, roleLabels } from "@/lib/server/auth/permissions";

/** What each role may do, as visible text beside the role choices (not a tooltip). */
export function RoleDescriptions({ id }: { id?: string }) {
  return (
    <dl id={id} className="grid grid-cols-[max-content_1fr] gap-x-3 gap-y-0.5 text-xs">
      {roles.map((r) => (
        <div key={r} className="contents">
          <dt className="font-medium">{roleLabels[r]}</dt>
          <dd className="text-ink-soft">{roleDescriptions[r]}</dd>
        </div>
      ))}
    </dl>
  );
}

export type RoleSelectProps = { id: string; defaultValue?: Role; label: string; describedBy?: string };

export function RoleSelect({ id, defaultValue = "viewer", label, describedBy }: RoleSelectProps) {
  return (
    <>
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <select id={id} name="role" defaultValue={defaultValue} aria-describedby={describedBy} className="rounded border border-rule bg-sheet px-2 py-1.5 text-sm">
        {roles.map((r) => (
          <option key={r} value={r}>
            {roleLabels[r]}
          </option>
        ))}
      </select>
    </>
  );
}
