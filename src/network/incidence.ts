// Items grouped by integer keys into one offset array (a list a key, grown by push, is megabytes of garbage on
// 20,000 heads): the pipes at each node, the pipes of each run. Shared by the network stage and hydraulic models.

/** Group g's items are `members[start[g]]` … `members[start[g + 1] − 1]`, in item order. */
export interface Grouped {
  start: Int32Array;
  members: Int32Array;
}

/** Items 0 … n − 1 into `count` groups: item k goes into group `keys[0][k]`, into `keys[1][k]`, … (once for each list). */
export function grouped(count: number, keys: ArrayLike<number>[]): Grouped {
  const start = new Int32Array(count + 1);
  for (const list of keys) for (let k = 0; k < list.length; k++) start[list[k]! + 1]!++;
  for (let g = 0; g < count; g++) start[g + 1]! += start[g]!;
  const members = new Int32Array(start[count]!);
  const filled = start.slice(0, -1);
  const items = keys[0]?.length ?? 0;
  for (let k = 0; k < items; k++) for (const list of keys) members[filled[list[k]!]!++] = k;
  return { start, members };
}

/** The pipes at each of `n` nodes, pipes given by their ends: node v's are `incident[start[v]]` … (a loop on one node twice). */
export function incidence(n: number, from: ArrayLike<number>, to: ArrayLike<number>): { start: Int32Array; incident: Int32Array } {
  const { start, members } = grouped(n, [from, to]);
  return { start, incident: members };
}
