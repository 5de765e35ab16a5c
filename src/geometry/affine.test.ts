// Block placement transforms with exact expected world coordinates, worked by hand from the DXF
// INSERT definition (translate by −base, scale, rotate, translate to the insertion point; common practice).

import { describe, expect, it } from 'vitest';
import { apply, compose, determinant, insertPlacement } from './affine.js';

const close = (p: { x: number; y: number }, x: number, y: number) => {
  expect(p.x).toBeCloseTo(x, 12);
  expect(p.y).toBeCloseTo(y, 12);
};

describe('insertPlacement', () => {
  it('moves the base point to the insertion point', () => {
    const m = insertPlacement({ insertion: { x: 10, y: 20 }, base: { x: 2, y: 3 }, scaleX: 1, scaleY: 1, rotationDeg: 0 });
    close(apply(m, { x: 2, y: 3 }), 10, 20);
    close(apply(m, { x: 3, y: 3 }), 11, 20);
  });

  it('rotates 90° counter-clockwise about the insertion point: local (1, 0) → (0, 1) offset', () => {
    const m = insertPlacement({ insertion: { x: 5, y: 5 }, base: { x: 0, y: 0 }, scaleX: 1, scaleY: 1, rotationDeg: 90 });
    close(apply(m, { x: 1, y: 0 }), 5, 6);
  });

  it('mirrors with a negative x scale: local (2, 1) → (−2, 1) then placed', () => {
    const m = insertPlacement({ insertion: { x: 100, y: 0 }, base: { x: 0, y: 0 }, scaleX: -1, scaleY: 1, rotationDeg: 0 });
    close(apply(m, { x: 2, y: 1 }), 98, 1);
    expect(determinant(m)).toBeLessThan(0);
  });

  it('scales before rotating: local (1, 1) with scale (2, 3) and 180° → (−2, −3)', () => {
    const m = insertPlacement({ insertion: { x: 0, y: 0 }, base: { x: 0, y: 0 }, scaleX: 2, scaleY: 3, rotationDeg: 180 });
    close(apply(m, { x: 1, y: 1 }), -2, -3);
  });

  it('composes nested references: inner at (1, 0) in a block turned 90° at (10, 10)', () => {
    const outer = insertPlacement({ insertion: { x: 10, y: 10 }, base: { x: 0, y: 0 }, scaleX: 1, scaleY: 1, rotationDeg: 90 });
    const inner = insertPlacement({ insertion: { x: 1, y: 0 }, base: { x: 0, y: 0 }, scaleX: 1, scaleY: 1, rotationDeg: 0 });
    // inner origin → (1, 0) in the outer block → turned 90° → (0, 1) → + (10, 10)
    close(apply(compose(outer, inner), { x: 0, y: 0 }), 10, 11);
  });

  it('an extrusion of (0, 0, −1) reverses x in the object coordinate system', () => {
    const m = insertPlacement({ insertion: { x: 4, y: 2 }, base: { x: 0, y: 0 }, scaleX: 1, scaleY: 1, rotationDeg: 0, ocsMirror: true });
    close(apply(m, { x: 0, y: 0 }), -4, 2);
  });
});
