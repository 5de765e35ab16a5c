// The floor a design area's heads protect: each head's cell reaches half-way to its neighbours on its line and to
// the adjacent lines, or to the wall; the cells' union inside the room is the outline, its area the actual area.

import type { Coverage } from '../coverage/coverage.js';
import { clipPolygon } from '../geometry/clip.js';
import { dot, type Point } from '../geometry/point.js';
import { convexHolds, signedArea } from '../geometry/polygon.js';
import { unionOfRects, type Rect } from '../geometry/rect-union.js';
import type { Head } from '../read/plan.js';
import type { Outline } from '../read/types.js';
import { maxOf, minOf } from '../arrays.js';

/** The directions the area is measured in: along the branch lines and across them. */
export interface Frame {
  u: Point;
  v: Point;
}

export interface Floor {
  /** The outline's rings (pieces apart, holes clockwise), in plan feet. */
  outline: Point[][];
  /** Enclosed floor area, ft². */
  area: number;
  /** Longest extent along the lines of the area on one line, and the extent across the lines, ft. */
  length: number;
  width: number;
}

/**
 * The floor of the heads `ids`. `fallback` is the half-spacing a cell takes where a head has neither a neighbour nor
 * a wall in reach (along, across).
 */
export function floorOf(
  heads: Head[],
  coverage: Map<string, Coverage>,
  frame: Frame,
  roomOf: (p: Point) => Outline | null,
  fallback: { along: number; across: number },
): Floor {
  const cells = heads.map((h) => cellOf(h, coverage.get(h.id), frame, fallback));
  const rings = unionOfRects(cells);
  const world = (p: Point): Point => ({ x: frame.u.x * p.x + frame.v.x * p.y, y: frame.u.y * p.x + frame.v.y * p.y });
  // Cells reach the walls along and across the lines; a room of another shape (an L, a slanted wall) cuts them.
  const rooms = [...new Set(heads.map((h) => roomOf(h.position)))];
  const inRoom = rooms.length === 1 && rooms[0] ? rooms[0].points : null;
  const outline = rings
    .map((r) => r.map(world))
    .flatMap((ring) =>
      inRoom && signedArea(ring) > 0 && !convexHolds(inRoom, ring) ? clipPolygon(ring, inRoom).map(anticlockwise) : [ring],
    );
  const byLine = new Map<string, Rect[]>();
  heads.forEach((h, k) => {
    const line = coverage.get(h.id)?.branchLine ?? h.id;
    byLine.set(line, [...(byLine.get(line) ?? []), cells[k]!]);
  });
  const length = maxOf([0, ...[...byLine.values()].map((rs) => maxOf(rs.map((r) => r.x1)) - minOf(rs.map((r) => r.x0)))]);
  const width = cells.length ? maxOf(cells.map((r) => r.y1)) - minOf(cells.map((r) => r.y0)) : 0;
  return { outline, area: outline.reduce((s, ring) => s + signedArea(ring), 0), length, width };
}

const anticlockwise = (ring: Point[]): Point[] => (signedArea(ring) < 0 ? [...ring].reverse() : ring);

/** A head's cell in the frame's coordinates (x along the lines, y across them). */
function cellOf(head: Head, c: Coverage | undefined, frame: Frame, fallback: { along: number; across: number }): Rect {
  const t = dot(head.position, frame.u);
  const o = dot(head.position, frame.v);
  if (!c) return { x0: t - fallback.along, x1: t + fallback.along, y0: o - fallback.across, y1: o + fallback.across };
  const reach = (neighbour: number | null, wall: number | null, half: number) => (neighbour !== null ? neighbour / 2 : (wall ?? half));
  const back = reach(c.headAlong[0], c.wallAlong[0], fallback.along);
  const fwd = reach(c.headAlong[1], c.wallAlong[1], fallback.along);
  const left = reach(c.lineAcross[0], c.wallAcross[0], fallback.across);
  const right = reach(c.lineAcross[1], c.wallAcross[1], fallback.across);
  // The line's own directions may run against the frame's.
  const sameAlong = dot(c.direction, frame.u) >= 0;
  const sameAcross = dot({ x: -c.direction.y, y: c.direction.x }, frame.v) >= 0;
  return {
    x0: t - (sameAlong ? back : fwd),
    x1: t + (sameAlong ? fwd : back),
    y0: o - (sameAcross ? right : left),
    y1: o + (sameAcross ? left : right),
  };
}
