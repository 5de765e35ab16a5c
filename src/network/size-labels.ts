// Gives each pipe stroke its nominal size from the nearest size label within reach; a label also sizes the
// other strokes of the same drawn entity that have none of their own. Unlabelled strokes get no size here.

import RBush from 'rbush';
import type { IndexedBox } from '../geometry/boxes.js';
import { distanceToSegment, type Point } from '../geometry/point.js';
import type { Stroke, TextItem } from '../read/types.js';
import { parseSizeLabel, type NominalSize } from '../quantities/pipe-sizes.js';
import { maxOf, minOf } from '../arrays.js';

function distanceToStroke(p: Point, s: Stroke): number {
  const pts = [s.a, ...s.via, s.b];
  let d = Infinity;
  for (let k = 1; k < pts.length; k++) d = Math.min(d, distanceToSegment(p, pts[k - 1]!, pts[k]!));
  return d;
}

/**
 * Each stroke's size from the nearest readable label within `reach`, and the labels that read like sizes but name
 * none (`99"`), by the stroke they stand beside, so that the assumption made there can quote them.
 */
export function sizesFromLabels(
  strokes: Stroke[],
  labels: TextItem[],
  reach: number,
): { sizes: (NominalSize | null)[]; unread: Map<number, string[]> } {
  const index = new RBush<IndexedBox>();
  index.load(
    strokes.map((s, i) => {
      const xs = [s.a.x, s.b.x, ...s.via.map((v) => v.x)];
      const ys = [s.a.y, s.b.y, ...s.via.map((v) => v.y)];
      return { minX: minOf(xs), minY: minOf(ys), maxX: maxOf(xs), maxY: maxOf(ys), i };
    }),
  );
  const own: (NominalSize | null)[] = strokes.map(() => null);
  const ownDistance = strokes.map(() => Infinity);
  const unread = new Map<number, string[]>();
  for (const label of labels) {
    const size = parseSizeLabel(label.text);
    // Measure from the label's insertion point and from a point half a text height above it (its middle).
    const probes = [label.position, { x: label.position.x, y: label.position.y + label.height / 2 }];
    let best = -1;
    let bestD = Infinity;
    const p = label.position;
    for (const box of index.search({ minX: p.x - reach, minY: p.y - reach, maxX: p.x + reach, maxY: p.y + reach })) {
      const d = Math.min(...probes.map((q) => distanceToStroke(q, strokes[box.i]!)));
      if (d <= reach && d < bestD) {
        best = box.i;
        bestD = d;
      }
    }
    if (best < 0) continue;
    if (!size) unread.set(best, [...(unread.get(best) ?? []), label.text.trim()]);
    else if (bestD < ownDistance[best]!) {
      own[best] = size;
      ownDistance[best] = bestD;
    }
  }
  const byHandle = new Map<string, NominalSize>();
  strokes.forEach((s, i) => {
    const v = own[i];
    if (v && !byHandle.has(s.handle)) byHandle.set(s.handle, v);
  });
  return { sizes: strokes.map((s, i) => own[i] ?? byHandle.get(s.handle) ?? null), unread };
}
