// Loops over arrays of any length where spreading them into a call would overflow the stack (V8 takes about a
// hundred thousand arguments at most: a wall of 130,000 vertices is input, not a bug), and bisection of sorted keys.

/** The largest value, or `empty` for none. */
export function maxOf(values: Iterable<number>, empty = -Infinity): number {
  let m = -Infinity;
  let any = false;
  for (const v of values) {
    if (v > m) m = v;
    any = true;
  }
  return any ? m : empty;
}

/** The smallest value, or `empty` for none. */
export function minOf(values: Iterable<number>, empty = Infinity): number {
  let m = Infinity;
  let any = false;
  for (const v of values) {
    if (v < m) m = v;
    any = true;
  }
  return any ? m : empty;
}

/** Appends every item of `items` to `into` (in place). */
export function pushAll<T>(into: T[], items: Iterable<T>): T[] {
  for (const x of items) into.push(x);
  return into;
}

/** The first index from 0 to `length` whose key is at least `x`, for keys ascending with the index (bisection). */
export function lowerBound(length: number, key: (i: number) => number, x: number): number {
  let lo = 0;
  let hi = length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (key(mid) < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
