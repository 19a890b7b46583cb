import { roles, type Role } from "@/db/schema";
import { roleDescriptions, roleLabels } from "@/lib/server/auth/permissions";

export type RoleSelectProps = { id: string; defaultValue?: Role; label: string };

export function RoleSelect({ id, defaultValue = "viewer", label }: RoleSelectProps) {
  return (
    <>
      <label htmlFor={id} className="sr-only">
        {label}
      </label>
      <select id={id} name="role" defaultValue={defaultValue} className="rounded border border-rule bg-sheet px-2 py-1.5 text-sm">
        {roles.map((r) => (
          <option key={r} value={r} title={roleDescriptions[r]}>
            {roleLabels[r]}
          </option>
        ))}
      </select>
    </>
  );
}
