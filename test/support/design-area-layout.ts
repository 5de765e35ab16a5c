// The layout the design-area rules are tested on: 8 heads a line from x = 6 to 90 ft, lines at y = 5..55,
// 12 × 10 ft, OH2 0.20 gpm/ft² over 1500 ft²; the area the search finds there, and areas drawn elsewhere.

import type { Point } from '../../src/geometry/point.js';

export const areaLayout = { s: 12, l: 10, heads: 8, lines: 6 };
export const areaConfig = { design: { density: 0.2, area: 1500 } };

/**
 * The remote area as a designer draws it in one outline: 12 heads at x = 54..90 on the lines y = 5..25 and the 13th
 * under the rectangle at (54, 35). The search's most demanding area takes the 13th at the cross-main end (6, 35)
 * instead, 0.04 psi more at the source: within what design-area-not-remote counts as equal.
 */
export const remoteOutline: Point[] = [
  { x: 48, y: 0 },
  { x: 96, y: 0 },
  { x: 96, y: 30 },
  { x: 60, y: 30 },
  { x: 60, y: 40 },
  { x: 48, y: 40 },
];

/** A drawn area on the riser's side: the 12 heads at x ≤ 48, y = 25..45 (48 ft along the lines). */
export const nearRiser: Point[] = [
  { x: 0, y: 20 },
  { x: 48, y: 20 },
  { x: 48, y: 50 },
  { x: 0, y: 50 },
];
