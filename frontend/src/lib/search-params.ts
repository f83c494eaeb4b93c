/** The search with the changes applied: a value sets its key, an empty or missing one removes it. */
export function changeSearch(current: URLSearchParams, changes: Record<string, string | undefined>) {
  const next = new URLSearchParams(current);
  for (const [key, value] of Object.entries(changes)) {
    if (value) next.set(key, value);
    else next.delete(key);
  }
  return next;
}
