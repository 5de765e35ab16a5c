// Clips one simple polygon to another with @flatten-js/core's boolean intersection, for drawing a searched design
// area inside the room that holds it: every piece of the intersection, as rings.

import * as flatten from '@flatten-js/core';
import type { Point } from './point.js';

const F = ((flatten as unknown as { default?: typeof flatten }).default ?? flatten) as typeof flatten;

/** The pieces of `subject` inside `clip` (none where they do not overlap), or `subject` itself where the operation fails. */
export function clipPolygon(subject: Point[], clip: Point[]): Point[][] {
  if (subject.length < 3 || clip.length < 3) return [subject];
  try {
    const result = F.BooleanOperations.intersect(
      new F.Polygon(subject.map((p) => [p.x, p.y] as [number, number])),
      new F.Polygon(clip.map((p) => [p.x, p.y] as [number, number])),
    );
    const pieces: Point[][] = [];
    for (const face of result.faces as Iterable<flatten.Face>) {
      if (Math.abs(face.area()) < 1e-9) continue;
      pieces.push(face.edges.map((e: flatten.Edge) => ({ x: e.start.x, y: e.start.y })));
    }
    return pieces;
  } catch {
    return [subject]; // degenerate input (self-touching outlines): the subject unclipped
  }
}
