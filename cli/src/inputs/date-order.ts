// Row order by date. Dates may come in any order (vendor files are often newest first): rows are
// sorted ascending; a date that appears twice is refused, naming the later of the two lines.

/** Row indices in ascending date order (stable), or null when the rows are already strictly ascending. */
export function ascendingOrder(days: Int32Array): Int32Array | null {
  let ascending = true;
  for (let i = 1; i < days.length && ascending; i++) ascending = days[i - 1]! < days[i]!;
  if (ascending) return null;
  const order = Array.from({ length: days.length }, (_, i) => i);
  order.sort((a, b) => days[a]! - days[b]! || a - b);
  return Int32Array.from(order);
}

export interface RepeatedDate {
  /** Row index of the first occurrence and of the repeat (the later row in the file). */
  readonly first: number;
  readonly repeat: number;
}

/** The first repeated date in file order of the repeat, or null. `order` as from ascendingOrder. */
export function findRepeatedDate(days: Int32Array, order: Int32Array | null): RepeatedDate | null {
  let found: RepeatedDate | null = null;
  for (let k = 1; k < days.length; k++) {
    const previous = order === null ? k - 1 : order[k - 1]!;
    const current = order === null ? k : order[k]!;
    if (days[previous] === days[current] && (found === null || current < found.repeat)) {
      found = { first: previous, repeat: current };
    }
  }
  return found;
}

export function permuteFloat64(values: Float64Array, order: Int32Array | null): Float64Array {
  return order === null ? values : Float64Array.from(order, (i) => values[i]!);
}

export function permuteInt32(values: Int32Array, order: Int32Array | null): Int32Array {
  return order === null ? values : Int32Array.from(order, (i) => values[i]!);
}
