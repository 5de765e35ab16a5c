// Places text labels near their anchors so that no two overlap and none covers a kept-clear box: each label takes
// the first free spot on rings of candidate spots around its anchor, nearest first (an R-tree of placed boxes).

import RBush from 'rbush';
import type { Point } from './point.js';

/** How many rings of spots a label tries before it settles, overlapping, at its first spot. */
const MAX_RINGS = 200;

export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export interface LabelRequest {
  /** The point the label is about. */
  at: Point;
  width: number;
  height: number;
  /** How far from the anchor the label must keep at least (a ring drawn around it). */
  clear?: number;
}

export interface PlacedLabel extends Box {
  /** Whether the label sits away from its anchor (a leader line helps the reader). */
  moved: boolean;
}

/**
 * Boxes (min corner and size) for each request, in order: earlier requests get the nearer spots. `gap` is the
 * clearance kept from the anchor and between labels; `keepClear` boxes are never covered.
 */
export function placeLabels(requests: LabelRequest[], keepClear: Box[], gap: number): PlacedLabel[] {
  const tree = new RBush<Box>();
  tree.load(keepClear);
  const free = (b: Box) =>
    tree.search({ minX: b.minX - gap / 2, minY: b.minY - gap / 2, maxX: b.maxX + gap / 2, maxY: b.maxY + gap / 2 }).length === 0;
  return requests.map(({ at, width: w, height: h, clear = 0 }) => {
    // Right above, right below, left above, left below, above, below; then the same farther out, ring by ring.
    const spots = (d: number): [number, number][] => [
      [at.x + d, at.y + d],
      [at.x + d, at.y - d - h],
      [at.x - d - w, at.y + d],
      [at.x - d - w, at.y - d - h],
      [at.x - w / 2, at.y + d],
      [at.x - w / 2, at.y - d - h],
    ];
    let chosen: Box | null = null;
    let ring = 0;
    for (; !chosen && ring < MAX_RINGS; ring++) {
      const d = clear + gap * (1 + ring) + (ring > 0 ? h * ring : 0);
      for (const [x, y] of spots(d)) {
        const b = { minX: x, minY: y, maxX: x + w, maxY: y + h };
        if (free(b)) {
          chosen = b;
          break;
        }
      }
    }
    // Nowhere free within reach (a crowd in a bounded space): the first spot, overlapping.
    const [x, y] = spots(clear + gap)[0]!;
    chosen ??= { minX: x, minY: y, maxX: x + w, maxY: y + h };
    tree.insert(chosen);
    return { ...chosen, moved: ring > 1 };
  });
}
