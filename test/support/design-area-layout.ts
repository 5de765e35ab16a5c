// The layout the design-area rules are tested on: 8 heads a line from x = 6 to 90 ft, lines at y = 5..55,
// 12 × 10 ft, OH2 0.20 gpm/ft² over 1500 ft²; the area the search finds there, and areas drawn elsewhere.

import type { Point } from '../../src/geometry/point.js';
import { checkLayout } from './check.js';

export const areaLayout = { s: 12, l: 10, heads: 8, lines: 6 };
export const areaConfig = { design: { density: 0.2, area: 1500 } };

/** The most demanding area's outline, as the search draws it. */
export const searchedOutline = (): Point[] =>
  checkLayout(areaLayout, areaConfig).design.areas.find((a) => a.rank === 'most-demanding')!.outline;

/** A drawn area on the riser's side: the 12 heads at x ≤ 48, y = 25..45 (48 ft along the lines). */
export const nearRiser: Point[] = [
  { x: 0, y: 20 },
  { x: 48, y: 20 },
  { x: 48, y: 50 },
  { x: 0, y: 50 },
];
