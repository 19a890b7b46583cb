import { eventTypeDescriptions, subscribableEventTypes } from "@/lib/server/webhooks/events/event-types";

export type EventCheckboxesProps = { idPrefix: string; selected: readonly string[]; error?: string };

export function EventCheckboxes({ idPrefix, selected, error }: EventCheckboxesProps) {
  return (
    <fieldset aria-describedby={error ? `${idPrefix}-events-error` : undefined}>
      <legend className="mb-1 text-xs font-medium uppercase tracking-wide text-ink-soft">Events</legend>
      {subscribableEventTypes.map((type) => (
        <label key={type} className="flex items-start gap-2 py-0.5 text-sm">
          <input type="checkbox" name={`event:${type}`} defaultChecked={selected.includes(type)} className="mt-1" />
          <span>
            <code>{type}</code> <span className="text-ink-soft">· {eventTypeDescriptions[type]}</span>
          </span>
        </label>
      ))}
      {error ? (
        <span id={`${idPrefix}-events-error`} className="mt-1 block text-xs text-fail">
          {error}
        </span>
      ) : null}
    </fieldset>
  );
}
