/** A pick line's location as a site would sort it. */
export interface LocatedStop {
  stop: number;
  code: string;
  aisle: number;
  bay: number;
  level: number;
}

/**
 * The site's unoptimised walk: lines by location code, aisle by aisle, bays ascending in odd
 * aisles and descending in even ones (a serpentine), each stop visited where its first line falls.
 */
export function baselineOrder(lines: readonly LocatedStop[]): number[] {
  const sorted = [...lines].sort(
    (a, b) =>
      a.aisle - b.aisle ||
      (a.aisle % 2 === 0 ? b.bay - a.bay : a.bay - b.bay) ||
      a.level - b.level ||
      (a.code < b.code ? -1 : a.code > b.code ? 1 : 0),
  );
  return [...new Set(sorted.map((l) => l.stop))];
}
