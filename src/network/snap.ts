// Turns drawn pipe strokes into graph edges: splits straight strokes where another stroke ends or a head
// sits on their interior (T-junctions), then merges endpoints closer than the snap tolerance into nodes.
// Strokes that cross without a shared vertex stay apart: pipes drawn over each other are common.
// A stroke drawn twice over one course is kept once (a drafting slip, not two pipes in parallel); zero-length
// pieces are dropped.

import RBush from 'rbush';
import type { IndexedBox } from '../geometry/boxes.js';
import { PointGrid } from '../geometry/point-grid.js';
import { closestOnSegment, distance, type Point } from '../geometry/point.js';
import type { Stroke } from '../read/types.js';

export interface Edge {
  stroke: number;
  points: Point[];
  a: number;
  b: number;
}

export interface SnappedGraph {
  nodes: Point[];
  edges: Edge[];
  /** Node index for each attach point given, or -1 where nothing was within reach. */
  attached: number[];
}

const strokePoints = (s: Stroke): Point[] => [s.a, ...s.via, s.b];

function boxOf(points: Point[], pad: number, i: number): IndexedBox {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const p of points) {
    minX = Math.min(minX, p.x);
    minY = Math.min(minY, p.y);
    maxX = Math.max(maxX, p.x);
    maxY = Math.max(maxY, p.y);
  }
  return { minX: minX - pad, minY: minY - pad, maxX: maxX + pad, maxY: maxY + pad, i };
}

/**
 * @param strokes pipe linework
 * @param attachPoints points (heads, sources) to connect, each with its own reach
 * @param snap endpoint snap tolerance, feet
 */
export function snapStrokes(strokes: Stroke[], attachPoints: { at: Point; reach: number }[], snap: number): SnappedGraph {
  const index = new RBush<IndexedBox>();
  const twin = twinStrokes(strokes, snap);
  index.load(strokes.flatMap((s, i) => (twin[i] ? [] : [boxOf(strokePoints(s), 0, i)])));
  const cuts: number[][] = strokes.map(() => []);
  const attachTarget: (Point | null)[] = [];

  // Where a point lands on the interior of a straight stroke, cut the stroke there.
  const landOn = (p: Point, reach: number, exclude: number): Point | null => {
    let best: { d: number; point: Point; stroke: number; t: number } | null = null;
    for (const box of index.search({ minX: p.x - reach, minY: p.y - reach, maxX: p.x + reach, maxY: p.y + reach })) {
      if (box.i === exclude) continue;
      const pts = strokePoints(strokes[box.i]!);
      for (let k = 1; k < pts.length; k++) {
        const c = closestOnSegment(p, pts[k - 1]!, pts[k]!);
        const d = distance(p, c.point);
        if (d <= reach && (!best || d < best.d)) best = { d, point: c.point, stroke: box.i, t: pts.length === 2 ? c.t : -1 };
      }
    }
    if (!best) return null;
    const s = strokes[best.stroke]!;
    const nearEnd = distance(best.point, s.a) <= snap || distance(best.point, s.b) <= snap;
    if (!nearEnd && best.t > 0 && best.t < 1) cuts[best.stroke]!.push(best.t);
    return nearEnd ? (distance(best.point, s.a) <= distance(best.point, s.b) ? s.a : s.b) : best.point;
  };

  strokes.forEach((s, i) => {
    if (!twin[i]) for (const end of [s.a, s.b]) landOn(end, snap, i);
  });
  for (const ap of attachPoints) attachTarget.push(landOn(ap.at, ap.reach, -1));

  // Cut strokes into edges.
  const pieces: { stroke: number; points: Point[] }[] = [];
  strokes.forEach((s, i) => {
    if (twin[i]) return;
    const pts = strokePoints(s);
    const ts = [...new Set(cuts[i])].sort((x, y) => x - y);
    if (pts.length > 2 || ts.length === 0) {
      pieces.push({ stroke: i, points: pts });
      return;
    }
    let prev = s.a;
    for (const t of ts) {
      const q = { x: s.a.x + (s.b.x - s.a.x) * t, y: s.a.y + (s.b.y - s.a.y) * t };
      if (distance(prev, q) > snap) {
        pieces.push({ stroke: i, points: [prev, q] });
        prev = q;
      }
    }
    pieces.push({ stroke: i, points: [prev, s.b] });
  });

  // Merge endpoints into nodes.
  const nodes: Point[] = [];
  const nodeIndex = new PointGrid(snap);
  /** The nearest node within the snap tolerance (the first made among equals), else a new one. */
  const nodeAt = (p: Point): number => {
    let best = -1;
    let bestD = Infinity;
    nodeIndex.visitNear(p, (i) => {
      const d = distance(p, nodes[i]!);
      if (d <= snap && (d < bestD || (d === bestD && i < best))) {
        best = i;
        bestD = d;
      }
      return false;
    });
    if (best >= 0) return best;
    nodes.push(p);
    nodeIndex.insert(p, nodes.length - 1);
    return nodes.length - 1;
  };
  const edges: Edge[] = [];
  for (const piece of pieces) {
    const a = nodeAt(piece.points[0]!);
    const b = nodeAt(piece.points[piece.points.length - 1]!);
    if (a !== b) edges.push({ stroke: piece.stroke, points: piece.points, a, b });
  }
  const attached = attachTarget.map((p) => (p ? nodeAt(p) : -1));
  const onEdge = new Set(edges.flatMap((e) => [e.a, e.b]));
  return { nodes, edges, attached: attached.map((n) => (onEdge.has(n) ? n : -1)) };
}

/** For each stroke, whether an earlier one follows the same points (either way round) within `tol`. */
function twinStrokes(strokes: Stroke[], tol: number): boolean[] {
  const byStart = new PointGrid(tol);
  return strokes.map((s, i) => {
    const pts = strokePoints(s);
    const follows = (j: number) => {
      const other = strokePoints(strokes[j]!);
      if (other.length !== pts.length) return false;
      const along = distance(other[0]!, pts[0]!) <= tol ? other : [...other].reverse();
      return along.every((p, k) => distance(p, pts[k]!) <= tol);
    };
    const same = byStart.visitNear(s.a, follows) || byStart.visitNear(s.b, follows);
    if (!same) byStart.insert(s.a, i);
    return same;
  });
}
