/**
 * Marker table numbers: the composer's table, the strip, the warnings and the schedule all number
 * markers 1–N the same way — by age, oldest first (marker 1 is the first a visitor reaches from the
 * older end); equal ages keep the order they were added in (ascending id, numeric ids as numbers).
 */

function isNumericId(s: string): boolean {
  if (s.length === 0) return false;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 48 || c > 57) return false;
  }
  return true;
}

/** Order of two ids: numeric ids as numbers ("9" before "10"), others as text, numbers first. */
export function compareIds(a: string, b: string): number {
  const na = isNumericId(a);
  const nb = isNumericId(b);
  if (na && nb) return a.length - b.length || (a < b ? -1 : a > b ? 1 : 0);
  if (na !== nb) return na ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Sorts in place into table order (oldest first, then by id) and returns the same array. */
export function sortByTableOrder<T>(items: T[], ageOf: (t: T) => number, idOf: (t: T) => string): T[] {
  return items.sort((x, y) => ageOf(y) - ageOf(x) || compareIds(idOf(x), idOf(y)));
}

/** Table number (1–N) of every id. */
export function tableNumbers<T>(items: readonly T[], ageOf: (t: T) => number, idOf: (t: T) => string): Map<string, number> {
  const sorted = sortByTableOrder([...items], ageOf, idOf);
  const out = new Map<string, number>();
  sorted.forEach((t, i) => out.set(idOf(t), i + 1));
  return out;
}

/** Are the ids strictly ascending by compareIds? One pass; each id is looked at once. */
export function idsAscending(ids: readonly string[]): boolean {
  if (ids.length < 2) return true;
  let prev = ids[0];
  let prevNumeric = isNumericId(prev);
  for (let i = 1; i < ids.length; i++) {
    const id = ids[i];
    const numeric = isNumericId(id);
    // compareIds(prev, id) < 0
    if (prevNumeric && numeric) {
      if (!(prev.length < id.length || (prev.length === id.length && prev < id))) return false;
    } else if (prevNumeric !== numeric) {
      if (!prevNumeric) return false;
    } else if (!(prev < id)) return false;
    prev = id;
    prevNumeric = numeric;
  }
  return true;
}

/** Ids sorted for a warning key: "137,140". */
export function sortedIds(ids: readonly string[]): string[] {
  return idsAscending(ids) ? [...ids] : sortIds(ids);
}

/** A sorted copy of ids that are not in order. */
function sortIds(ids: readonly string[]): string[] {
  if (!ids.every(isNumericId)) return [...ids].sort(compareIds);
  const values = ids.map(Number);
  return Array.from(ids, (_, i) => i)
    .sort((x, y) => values[x] - values[y] || compareIds(ids[x], ids[y]))
    .map((i) => ids[i]);
}

/** A warning's stable key: its code and the ids it is about, e.g. "markers-too-close:137,140". */
export function warningKey(code: string, ids: readonly string[]): string {
  return `${code}:${(idsAscending(ids) ? ids : sortIds(ids)).join(",")}`;
}
