// Plain 2D points and the few vector operations every stage needs.
// Points are immutable value objects `{ x, y }`; functions never mutate their inputs.

export interface Point {
  readonly x: number;
  readonly y: number;
}

export const add = (a: Point, b: Point): Point => ({ x: a.x + b.x, y: a.y + b.y });
export const sub = (a: Point, b: Point): Point => ({ x: a.x - b.x, y: a.y - b.y });
export const scale = (a: Point, k: number): Point => ({ x: a.x * k, y: a.y * k });
export const dot = (a: Point, b: Point): number => a.x * b.x + a.y * b.y;
export const cross = (a: Point, b: Point): number => a.x * b.y - a.y * b.x;
export const length = (a: Point): number => Math.hypot(a.x, a.y);
export const distance = (a: Point, b: Point): number => Math.hypot(a.x - b.x, a.y - b.y);

/** Unit vector of `a`, or (1, 0) for a zero vector. */
export function unit(a: Point): Point {
  const n = length(a);
  return n === 0 ? { x: 1, y: 0 } : { x: a.x / n, y: a.y / n };
}

/** Closest point to `p` on segment a–b, with its parameter t in [0, 1]. */
export function closestOnSegment(p: Point, a: Point, b: Point): { point: Point; t: number } {
  const ab = sub(b, a);
  const len2 = dot(ab, ab);
  const t = len2 === 0 ? 0 : Math.min(1, Math.max(0, dot(sub(p, a), ab) / len2));
  return { point: add(a, scale(ab, t)), t };
}

/** Distance from `p` to segment a–b. */
export const distanceToSegment = (p: Point, a: Point, b: Point): number => distance(p, closestOnSegment(p, a, b).point);

/** Axis-aligned bounds of a set of points. */
export interface Bounds {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

export function boundsOf(points: Iterable<Point>): Bounds {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const p of points) {
    if (p.x < minX) minX = p.x;
    if (p.y < minY) minY = p.y;
    if (p.x > maxX) maxX = p.x;
    if (p.y > maxY) maxY = p.y;
  }
  return { minX, minY, maxX, maxY };
}
