// Rows of heads without piping: the layout's main direction from each head's nearest neighbour (found through
// boxes that double in size), rows across it, and equally near neighbours decided by the head drawn first.

import { describe, expect, it } from 'vitest';
import type { Head } from '../read/plan.js';
import { headRows } from './rows.js';
import type { Walls } from './walls.js';

const noWalls: Walls = { along: () => null, nearest: () => null, roomOf: () => null, count: 0 };

/** Heads drawn row by row: `columns` along `u` at `along` ft, `rows` across it at `across` ft. */
function field(columns: number, rows: number, along: number, across: number, deg: number): Head[] {
  const u = { x: Math.cos((deg * Math.PI) / 180), y: Math.sin((deg * Math.PI) / 180) };
  const heads: Head[] = [];
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < columns; c++) {
      const position = { x: 100 + c * along * u.x - r * across * u.y, y: 50 + c * along * u.y + r * across * u.x };
      const id = `H${heads.length + 1}`;
      heads.push({ id, handle: id, layer: 'HEADS', block: 'SPK', position, kFactor: 5.6, elevation: 12, kind: 'standard', attributes: {} });
    }
  return heads;
}

// Layouts and the rows expected of them worked out by hand (common practice, no source).
describe('headRows', () => {
  it('a field packed at 6 in along, 18 in across, turned 20°: one row a line of the field, along its 6 in', () => {
    const rows = headRows(field(40, 30, 0.5, 1.5, 20), noWalls);
    expect(rows).toHaveLength(30);
    expect(rows.every((r) => r.headIds.length === 40)).toBe(true);
    expect((Math.atan2(rows[0]!.direction.y, rows[0]!.direction.x) * 180) / Math.PI).toBeCloseTo(20, 6);
  });

  it('heads 20 ft and 25 ft apart: the neighbours are found past the first boxes', () => {
    const rows = headRows(field(4, 3, 20, 25, 0), noWalls);
    expect(rows.map((r) => r.headIds.length)).toEqual([4, 4, 4]);
  });

  it('a square grid drawn row by row: the neighbour drawn first is the one below, so rows run up the columns', () => {
    const rows = headRows(field(5, 5, 10, 10, 0), noWalls);
    expect(rows).toHaveLength(5);
    expect(Math.abs(rows[0]!.direction.y)).toBeCloseTo(1, 12);
    expect(rows.map((r) => r.headIds)).toContainEqual(['H1', 'H6', 'H11', 'H16', 'H21']);
  });
});
