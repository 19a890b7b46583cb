export type MemberNotesProps = { notes: string[] };

/** Assumptions intake made and the engine's remarks on one member (e.g. "gross section: cracking not included"); nothing when there are none. */
export function MemberNotes({ notes }: MemberNotesProps) {
  if (notes.length === 0) return null;
  return (
    <section aria-labelledby="notes-heading" className="rounded border border-caution/40 bg-caution-bg p-3 text-caution" data-testid="member-notes">
      <h2 id="notes-heading" className="font-semibold">
        Assumptions and remarks
      </h2>
      <ul className="mt-1 list-disc pl-5">
        {notes.map((note) => (
          <li key={note} className="[overflow-wrap:anywhere]">
            {note}
          </li>
        ))}
      </ul>
    </section>
  );
}
