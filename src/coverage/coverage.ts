// Protection area of each head as S × L, the standard's own method: S the larger of the distances to the next
// heads on its branch line or row (twice the wall distance for an end head), L likewise between lines.

import { cross, dot, type Point } from '../geometry/point.js';
import type { BranchLine, Network } from '../network/types.js';
import type { Head } from '../read/plan.js';
import { headRows } from './rows.js';
import type { Walls } from './walls.js';
import { lowerBound, maxOf } from '../arrays.js';

export interface Coverage {
  headId: string;
  /** The branch line the head is measured along, or the row (R1…) of heads it stands in where no line holds it. */
  branchLine: string;
  /** Unit vector along the line (S is measured along it, L across it; "left" is a quarter turn anticlockwise). */
  direction: Point;
  /** Along the branch line, ft. */
  s: number | null;
  /** Across the branch lines, ft. */
  l: number | null;
  area: number | null;
  /** Distances to walls along the line (both ways) for an end head, and across it for an outer line; null where a head or line is nearer. */
  wallAlong: [number | null, number | null];
  wallAcross: [number | null, number | null];
  /** Neighbour distances along the line and to the adjacent lines, null where there is none. */
  headAlong: [number | null, number | null];
  /** The neighbouring heads along the line (before, after), null where there is none. */
  neighbours: [string | null, string | null];
  lineAcross: [number | null, number | null];
}

/** How far to look for a wall or a neighbouring line, ft (common practice, no source). */
const REACH_FT = 60;
/** Lines are parallel within this angle (common practice, no source). */
const PARALLEL_SIN = Math.sin((10 * Math.PI) / 180);

export function computeCoverage(heads: Head[], network: Network, walls: Walls): Map<string, Coverage> {
  const pos = new Map(heads.map((h) => [h.id, h.position]));
  const out = new Map<string, Coverage>();
  const piped = network.branchLines.filter((b) => b.headIds.length > 0);
  const onLines = new Set(piped.flatMap((b) => b.headIds));
  // Heads no branch line holds are measured along rows of their own (a layout without piping yet).
  const lines = [
    ...piped,
    ...headRows(
      heads.filter((h) => !onLines.has(h.id)),
      walls,
    ),
  ];
  const index = new LineIndex(lines.map((l) => summarise(l, pos)));
  for (const line of lines) {
    const u = line.direction;
    const v = { x: -u.y, y: u.x };
    const along = line.headIds.map((id) => ({ id, t: dot(pos.get(id)!, u) })).sort((a, b) => a.t - b.t);
    const near = linesNear(line, along, index, pos, v);
    along.forEach(({ id, t }, i) => {
      const p = pos.get(id)!;
      const before = i > 0 ? t - along[i - 1]!.t : null;
      const after = i + 1 < along.length ? along[i + 1]!.t - t : null;
      const wallBack = before === null ? walls.along(p, { x: -u.x, y: -u.y }, REACH_FT) : null;
      const wallFwd = after === null ? walls.along(p, u, REACH_FT) : null;
      const [left, right] = adjacentLines(p, line, near, v);
      const wallLeft = left === null ? walls.along(p, v, REACH_FT) : null;
      const wallRight = right === null ? walls.along(p, { x: -v.x, y: -v.y }, REACH_FT) : null;
      const s = largest(before, after, twice(wallBack), twice(wallFwd));
      const l = largest(left, right, twice(wallLeft), twice(wallRight));
      out.set(id, {
        headId: id,
        branchLine: line.id,
        direction: u,
        s,
        l,
        area: s !== null && l !== null ? s * l : null,
        wallAlong: [wallBack, wallFwd],
        wallAcross: [wallLeft, wallRight],
        headAlong: [before, after],
        lineAcross: [left, right],
        neighbours: [i > 0 ? along[i - 1]!.id : null, i + 1 < along.length ? along[i + 1]!.id : null],
      });
    });
  }
  return out;
}

/** What the neighbour search needs of a line, computed once: its centroid, its end heads, its head spacing. */
interface LineSummary {
  line: BranchLine;
  centroid: Point;
  ends: [Point, Point];
  spacing: number;
}

function summarise(line: BranchLine, pos: Map<string, Point>): LineSummary {
  const pts = line.headIds.map((id) => pos.get(id)!);
  const ts = pts.map((q) => dot(q, line.direction));
  // Indexes found by comparison, so that a non-finite coordinate still leaves a head at each end.
  let lo = 0;
  let hi = 0;
  ts.forEach((t, i) => {
    if (t < ts[lo]!) lo = i;
    if (t > ts[hi]!) hi = i;
  });
  const tMin = ts[lo]!;
  const tMax = ts[hi]!;
  const first = pts[lo]!;
  const last = pts[hi]!;
  const n = pts.length;
  return {
    line,
    centroid: { x: pts.reduce((a, q) => a + q.x, 0) / n, y: pts.reduce((a, q) => a + q.y, 0) / n },
    ends: [first, last],
    spacing: (tMax - tMin) / Math.max(1, n - 1),
  };
}

/** Directions are grouped by their angle (mod 180°) rounded to this many radians. */
const ANGLE_STEP = 1e-6;

/**
 * The lines by direction: each group, one angle to within ANGLE_STEP, sorted by its centroids' offset across the
 * group's direction, so that the lines beside a line of the same direction are a window found by bisection.
 */
class LineIndex {
  private readonly groups: { angle: number; normal: Point; offset: Float64Array; lines: LineSummary[] }[] = [];
  /** How far an offset measured across one direction of a group can be from one across another, ft. */
  private readonly slack: number;

  constructor(all: LineSummary[]) {
    const byAngle = new Map<number, LineSummary[]>();
    let extent = 0;
    for (const s of all) {
      // A line whose centroid is not finite is beside no line (no offset to it is within reach): left out.
      if (!Number.isFinite(s.centroid.x) || !Number.isFinite(s.centroid.y)) continue;
      const key = angleKey(s.line.direction);
      const list = byAngle.get(key);
      if (list) list.push(s);
      else byAngle.set(key, [s]);
      extent = Math.max(extent, Math.abs(s.centroid.x), Math.abs(s.centroid.y));
    }
    this.slack = 4 * ANGLE_STEP * extent + 1e-3;
    for (const [key, list] of byAngle) {
      const normal = { x: -list[0]!.line.direction.y, y: list[0]!.line.direction.x };
      const sorted = list.map((line) => ({ line, offset: dot(line.centroid, normal) })).sort((a, b) => a.offset - b.offset);
      this.groups.push({ angle: key, normal, offset: Float64Array.from(sorted, (x) => x.offset), lines: sorted.map((x) => x.line) });
    }
  }

  /**
   * A superset of the lines whose centroid lies between `lo` and `hi` across a line of direction u (normal v):
   * in the group of u's own direction by bisection, in every other group whole (they are few, or not parallel).
   */
  around(u: Point, v: Point, lo: number, hi: number): LineSummary[] {
    const key = angleKey(u);
    const out: LineSummary[] = [];
    for (const g of this.groups) {
      if (g.angle !== key) {
        out.push(...g.lines);
        continue;
      }
      const sign = dot(v, g.normal) >= 0 ? 1 : -1;
      const a = (sign > 0 ? lo : -hi) - this.slack;
      const b = (sign > 0 ? hi : -lo) + this.slack;
      for (let i = lowerBound(g.offset.length, (k) => g.offset[k]!, a); i < g.offset.length && g.offset[i]! <= b; i++)
        out.push(g.lines[i]!);
    }
    return out;
  }
}

/** A direction's angle mod 180°, in steps of ANGLE_STEP. */
function angleKey(u: Point): number {
  const angle = Math.atan2(u.y, u.x);
  return Math.round((angle < 0 ? angle + Math.PI : angle) / ANGLE_STEP) % Math.round(Math.PI / ANGLE_STEP);
}

/**
 * The lines that `adjacentLines` could accept for some head of `line`: its tests, taken over the range of the
 * line's heads (along u and across it), are necessary for each head. The index gives the lines across within
 * reach, so the heads × lines loop becomes heads × neighbours.
 */
function linesNear(
  line: BranchLine,
  along: { id: string; t: number }[],
  index: LineIndex,
  pos: Map<string, Point>,
  v: Point,
): LineSummary[] {
  const u = line.direction;
  const tLo = along[0]!.t;
  const tHi = along.at(-1)!.t;
  let vLo = Infinity;
  let vHi = -Infinity;
  for (const { id } of along) {
    const w = dot(pos.get(id)!, v);
    vLo = Math.min(vLo, w);
    vHi = Math.max(vHi, w);
  }
  return index.around(u, v, vLo - REACH_FT, vHi + REACH_FT).filter((other) => {
    if (other.line === line || Math.abs(cross(other.line.direction, u)) > PARALLEL_SIN) return false;
    const t0 = dot(other.ends[0], u);
    const t1 = dot(other.ends[1], u);
    const slack = Math.max(other.spacing, 1) * 0.75;
    if (tHi < Math.min(t0, t1) - slack || tLo > Math.max(t0, t1) + slack) return false;
    // A head's offset to the other line's centroid is dot(centroid, v) − dot(p, v), over the heads' range.
    const c = dot(other.centroid, v);
    return c - vHi <= REACH_FT && c - vLo >= -REACH_FT;
  });
}

/** Perpendicular distance to the nearest parallel branch line on each side that spans the head's position. */
function adjacentLines(p: Point, line: BranchLine, others: LineSummary[], v: Point): [number | null, number | null] {
  let left: number | null = null;
  let right: number | null = null;
  const u = line.direction;
  const tp = dot(p, u);
  for (const other of others) {
    if (other.line === line || Math.abs(cross(other.line.direction, u)) > PARALLEL_SIN) continue;
    // Heads on a straight line project monotonically, so its end heads give its extent along u.
    const t0 = dot(other.ends[0], u);
    const t1 = dot(other.ends[1], u);
    const slack = Math.max(other.spacing, 1) * 0.75;
    if (tp < Math.min(t0, t1) - slack || tp > Math.max(t0, t1) + slack) continue;
    // The mean perpendicular offset of its heads is the offset of their centroid.
    const off = dot({ x: other.centroid.x - p.x, y: other.centroid.y - p.y }, v);
    if (Math.abs(off) < 1e-6 || Math.abs(off) > REACH_FT) continue;
    if (off > 0 && (left === null || off < left)) left = off;
    if (off < 0 && (right === null || -off < right)) right = -off;
  }
  return [left, right];
}

const twice = (d: number | null) => (d === null ? null : 2 * d);
function largest(...xs: (number | null)[]): number | null {
  const v = xs.filter((x): x is number => x !== null);
  return v.length ? maxOf(v) : null;
}
