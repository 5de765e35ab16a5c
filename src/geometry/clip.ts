// Clips one simple polygon to another with @flatten-js/core's boolean intersection, for drawing a
// searched design area inside the room that holds it; the largest piece of the intersection is kept.

import * as flatten from '@flatten-js/core';
import type { Point } from './point.js';

const F = ((flatten as unknown as { default?: typeof flatten }).default ?? flatten) as typeof flatten;

/** The part of `subject` inside `clip`, or `subject` itself when they do not overlap or the operation fails. */
export function clipPolygon(subject: Point[], clip: Point[]): Point[] {
  if (subject.length < 3 || clip.length < 3) return subject;
  try {
    const result = F.BooleanOperations.intersect(
      new F.Polygon(subject.map((p) => [p.x, p.y] as [number, number])),
      new F.Polygon(clip.map((p) => [p.x, p.y] as [number, number])),
    );
    let best: Point[] = [];
    let bestArea = 0;
    for (const face of result.faces as Iterable<flatten.Face>) {
      const area = Math.abs(face.area());
      if (area > bestArea) {
        bestArea = area;
        best = face.edges.map((e: flatten.Edge) => ({ x: e.start.x, y: e.start.y }));
      }
    }
    return best.length >= 3 ? best : subject;
  } catch {
    return subject; // degenerate input (self-touching outlines): draw the area unclipped
  }
}
