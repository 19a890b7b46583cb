/** A JSON GET for the dashboard's own session routes; a non-2xx answer throws with the problem's title or detail. */
export async function fetchJson<T>(url: string, signal?: AbortSignal): Promise<T> {
  const response = await fetch(url, { cache: "no-store", headers: { accept: "application/json" }, signal });
  if (!response.ok) {
    let detail = `the server answered ${response.status}`;
    try {
      const problem = (await response.json()) as { detail?: string; title?: string };
      detail = problem.detail ?? problem.title ?? detail;
    } catch {
      // not JSON: keep the status
    }
    throw new Error(detail);
  }
  return (await response.json()) as T;
}
