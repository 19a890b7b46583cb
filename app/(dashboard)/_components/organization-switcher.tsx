"use client";

import { useActionState } from "react";

import { switchOrganization } from "../actions";

export type OrganizationSwitcherProps = { activeId: string; options: { id: string; name: string }[] };

/** Works without script too: choose, then press Switch. */
export function OrganizationSwitcher({ activeId, options }: OrganizationSwitcherProps) {
  const [state, action, pending] = useActionState(switchOrganization, null);
  if (options.length < 2) return <span className="text-xs font-medium">{options[0]?.name}</span>;
  return (
    <form action={action} className="flex items-center gap-1" aria-label="Switch organization">
      <label className="sr-only" htmlFor="organizationId">
        Organization
      </label>
      <select
        id="organizationId"
        name="organizationId"
        defaultValue={activeId}
        className="rounded border border-rule bg-sheet px-1 py-1 text-xs"
        onChange={(e) => e.currentTarget.form?.requestSubmit()}
      >
        {options.map((o) => (
          <option key={o.id} value={o.id}>
            {o.name}
          </option>
        ))}
      </select>
      <noscript>
        <button type="submit" className="rounded border border-rule px-2 py-1 text-xs">
          Switch
        </button>
      </noscript>
      {state && !state.ok ? <span role="alert" className="text-xs text-fail">{state.message}</span> : null}
      {pending ? <span className="text-xs text-ink-soft">…</span> : null}
    </form>
  );
}
