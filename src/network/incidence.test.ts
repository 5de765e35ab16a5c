// Items grouped by integer keys: each group's items in item order, an item once for each list that names the
// group (a pipe from a node to itself is at that node twice), and empty groups where no item falls.

import { describe, expect, it } from 'vitest';
import { grouped, incidence } from './incidence.js';

/** Group g's items as a plain list. */
const lists = ({ start, members }: { start: Int32Array; members: Int32Array }) =>
  Array.from({ length: start.length - 1 }, (_, g) => [...members.subarray(start[g]!, start[g + 1]!)]);

describe('grouped', () => {
  // Hand-made cases, their expected groups worked out by hand (common practice, no source).
  it.each([
    { keys: [[2, 0, 2, 1]], count: 4, want: [[1], [3], [0, 2], []] },
    { keys: [[]], count: 2, want: [[], []] },
    {
      keys: [
        [0, 1],
        [1, 1],
      ],
      count: 2,
      want: [[0], [0, 1, 1]],
    },
  ])('$keys into $count groups', ({ keys, count, want }) => {
    expect(lists(grouped(count, keys))).toEqual(want);
  });
});

describe('incidence', () => {
  it('lists the pipes at each node in pipe order, a loop on one node twice', () => {
    // Pipes 0: 0–1, 1: 1–2, 2: 2–2 (a loop), 3: 2–0; node 3 has none.
    const { start, incident } = incidence(4, [0, 1, 2, 2], [1, 2, 2, 0]);
    expect(lists({ start, members: incident })).toEqual([[0, 3], [0, 1], [1, 2, 2, 3], []]);
  });
});
