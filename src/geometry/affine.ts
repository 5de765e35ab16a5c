// 2D affine transforms for DXF block references: compose, apply, and build an INSERT's placement.
// A transform maps (x, y) to (a·x + c·y + e, b·x + d·y + f), the usual SVG/PDF matrix order.

import type { Point } from './point.js';

export interface Affine {
  readonly a: number;
  readonly b: number;
  readonly c: number;
  readonly d: number;
  readonly e: number;
  readonly f: number;
}

/** The transform that applies `inner` first, then `outer`. */
export function compose(outer: Affine, inner: Affine): Affine {
  return {
    a: outer.a * inner.a + outer.c * inner.b,
    b: outer.b * inner.a + outer.d * inner.b,
    c: outer.a * inner.c + outer.c * inner.d,
    d: outer.b * inner.c + outer.d * inner.d,
    e: outer.a * inner.e + outer.c * inner.f + outer.e,
    f: outer.b * inner.e + outer.d * inner.f + outer.f,
  };
}

export const apply = (m: Affine, p: Point): Point => ({
  x: m.a * p.x + m.c * p.y + m.e,
  y: m.b * p.x + m.d * p.y + m.f,
});

export const translation = (x: number, y: number): Affine => ({ a: 1, b: 0, c: 0, d: 1, e: x, f: y });
export const scaling = (sx: number, sy: number): Affine => ({ a: sx, b: 0, c: 0, d: sy, e: 0, f: 0 });
export function rotation(radians: number): Affine {
  const cos = Math.cos(radians);
  const sin = Math.sin(radians);
  return { a: cos, b: sin, c: -sin, d: cos, e: 0, f: 0 };
}

/** Determinant of the linear part; negative means the transform mirrors. */
export const determinant = (m: Affine): number => m.a * m.d - m.b * m.c;

/** Rotation of the transformed x axis, in radians. */
export const rotationOf = (m: Affine): number => Math.atan2(m.b, m.a);

/** Mean linear scale factor (√|det|), used to scale radii and lengths. */
export const meanScale = (m: Affine): number => Math.sqrt(Math.abs(determinant(m)));

/**
 * Placement of a block reference, per the DXF INSERT definition: move the block base point to the origin,
 * scale by (sx, sy), rotate, then move to the insertion point. `ocsMirror` handles an extrusion of (0, 0, -1),
 * whose object coordinate system has its x axis reversed.
 */
export function insertPlacement(opts: {
  insertion: Point;
  base: Point;
  scaleX: number;
  scaleY: number;
  rotationDeg: number;
  ocsMirror?: boolean;
}): Affine {
  const local = compose(
    rotation((opts.rotationDeg * Math.PI) / 180),
    compose(scaling(opts.scaleX, opts.scaleY), translation(-opts.base.x, -opts.base.y)),
  );
  const placed = compose(translation(opts.insertion.x, opts.insertion.y), local);
  return opts.ocsMirror ? compose(scaling(-1, 1), placed) : placed;
}
