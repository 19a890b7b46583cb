/** "YYYY-MM-DD HH:MM UTC", the one way the console shows a moment; "—" when there is none. */
export function formatDateTime(date: Date | null): string {
  if (!date) return "—";
  return `${date.toISOString().slice(0, 16).replace("T", " ")} UTC`;
}
