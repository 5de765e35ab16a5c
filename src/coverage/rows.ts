// Rows of heads that no branch line holds (a layout drawn before its piping, or heads off the pipes): heads in
// line along the layout's main direction, split at walls, so that their spacing and coverage are still checked.

import RBush from 'rbush';
import { pointBox, type IndexedBox } from '../geometry/boxes.js';
import { dot, type Point } from '../geometry/point.js';
import type { BranchLine } from '../network/types.js';
import type { Head } from '../read/plan.js';
import type { Walls } from './walls.js';

/** Heads whose offsets across the row differ by less than this are in one row, ft (common practice, no source). */
const ROW_TOLERANCE_FT = 1;
/** How far to look for a head's nearest neighbour, ft (twice the largest spacing of any hazard; common practice, no source). */
const NEIGHBOUR_REACH_FT = 30;

/** Rows of the given heads, named R1, R2…, in the shape of branch lines without pipes. */
export function headRows(heads: Head[], walls: Walls): BranchLine[] {
  if (heads.length === 0) return [];
  const u = mainDirection(heads);
  const v = { x: -u.y, y: u.x };
  const placed = heads.map((h) => ({ id: h.id, p: h.position, t: dot(h.position, u), o: dot(h.position, v) }));
  placed.sort((a, b) => a.o - b.o);
  const rows: BranchLine[] = [];
  let start = 0;
  for (let i = 1; i <= placed.length; i++) {
    if (i < placed.length && placed[i]!.o - placed[i - 1]!.o < ROW_TOLERANCE_FT) continue;
    const row = placed.slice(start, i).sort((a, b) => a.t - b.t);
    start = i;
    // A wall between two heads of a row parts it: they are in different rooms.
    let from = 0;
    for (let k = 1; k <= row.length; k++) {
      const gap = k < row.length ? row[k]!.t - row[k - 1]!.t : 0;
      if (k < row.length && (walls.along(row[k - 1]!.p, u, gap) ?? Infinity) >= gap) continue;
      rows.push({ id: `R${rows.length + 1}`, pipeIds: [], headIds: row.slice(from, k).map((x) => x.id), direction: u, feedNodeIds: [] });
      from = k;
    }
  }
  return rows;
}

/**
 * The direction most heads' nearest neighbours lie in, as a grid axis: nearest-neighbour directions are folded
 * into a quarter turn and the most common one (1° bins) is taken; of its two axes, the one more neighbours lie on.
 */
function mainDirection(heads: Head[]): Point {
  const index = new RBush<IndexedBox>();
  index.load(heads.map((h, i) => pointBox(h.position, i)));
  const folded = new Array<number>(90).fill(0);
  const angles: number[] = [];
  heads.forEach((h, i) => {
    const p = h.position;
    let best: Point | null = null;
    // Boxes doubling from a half-width of 1/2 ft: the nearest head found within the box's half-width is the nearest
    // of all (10,000 heads packed at 6 in: 6.6 s when each looked through all within the reach).
    for (let r = 0.5; !best; r *= 2) {
      const reach = Math.min(r, NEIGHBOUR_REACH_FT);
      let bestD = Infinity;
      let bestIndex = -1;
      for (const b of index.search({ minX: p.x - reach, minY: p.y - reach, maxX: p.x + reach, maxY: p.y + reach })) {
        if (b.i === i) continue;
        const q = heads[b.i]!.position;
        const d = Math.hypot(q.x - p.x, q.y - p.y);
        // The nearest; among equally near, the first drawn.
        if (d > 1e-9 && (d < bestD || (d === bestD && b.i < bestIndex))) {
          bestD = d;
          bestIndex = b.i;
        }
      }
      if (bestIndex >= 0 && (bestD <= reach || reach === NEIGHBOUR_REACH_FT)) best = heads[bestIndex]!.position;
      else if (reach === NEIGHBOUR_REACH_FT) break;
    }
    if (!best) return;
    const deg = ((((Math.atan2(best.y - p.y, best.x - p.x) * 180) / Math.PI) % 180) + 180) % 180;
    angles.push(deg);
    folded[Math.round(deg) % 90]!++;
  });
  const axis = folded.indexOf(Math.max(...folded));
  const near = (a: number, b: number) => Math.min(Math.abs(a - b), 180 - Math.abs(a - b)) <= 1;
  const onFirst = angles.filter((a) => near(a, axis)).length;
  const onSecond = angles.filter((a) => near(a, axis + 90)).length;
  const deg = onSecond > onFirst ? axis + 90 : axis;
  // The mean of the angles in the chosen bin, for drawings rotated by a fraction of a degree.
  const inBin = angles.filter((a) => near(a, deg)).map((a) => (Math.abs(a - deg) > 90 ? a + (a < deg ? 180 : -180) : a));
  const mean = inBin.length ? inBin.reduce((s, a) => s + a, 0) / inBin.length : deg;
  const rad = (mean * Math.PI) / 180;
  return { x: Math.cos(rad), y: Math.sin(rad) };
}
