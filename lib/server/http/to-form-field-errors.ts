import type { FieldError } from "@/lib/server/errors";

/** Longest message kept per field: a form shows it beside the control, not as a report. */
const MAX_FIELD_MESSAGE_CHARS = 2000;

/**
 * The form field a domain error belongs to. Domain functions speak JSON pointers ("/name",
 * "/definition/live"), forms name their controls ("name"): the pointer's first segment is the
 * control. A plain name passes through.
 */
export function toFormFieldName(error: Pick<FieldError, "pointer" | "column">): string {
  const pointer = error.pointer ?? error.column;
  if (!pointer) return "form";
  if (!pointer.startsWith("/")) return pointer;
  const first = pointer.slice(1).split("/")[0] ?? "";
  return first === "" ? "form" : first.replace(/~1/g, "/").replace(/~0/g, "~");
}

/** A domain error's list as one message per form field, several for the same field joined. */
export function toFormFieldErrors(errors: readonly FieldError[]): Record<string, string> {
  const byField: Record<string, string> = {};
  for (const error of errors) {
    const field = toFormFieldName(error);
    const joined = byField[field] === undefined ? error.message : `${byField[field]}; ${error.message}`;
    byField[field] = joined.slice(0, MAX_FIELD_MESSAGE_CHARS);
  }
  return byField;
}
