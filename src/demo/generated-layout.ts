// Generates rectangular sprinkler layouts as DXF text, for tests and the benchmark: a room, a riser, a cross
// main and branch lines with heads at given spacings, optionally gridded, moved, turned, in another unit.

import type { Point } from '../geometry/point.js';
import { DxfWriter } from './dxf-writer.js';

export interface LayoutSpec {
  /** Head spacing along the branch lines, ft. */
  s: number;
  /** Spacing between branch lines, ft. */
  l: number;
  heads: number;
  lines: number;
  /** Distance from the first/last head to the end walls, and from the outer lines to the side walls, ft. */
  wallAlong?: number;
  wallAcross?: number;
  /** Extra heads at given plan points (ft, in the unturned frame); one on a branch line attaches to it. */
  extraHeads?: Point[];
  /** Moves and turns the whole drawing (ft, degrees). */
  offset?: Point;
  rotationDeg?: number;
  /** Drawing unit and its $INSUNITS code. */
  unit?: { perFoot: number; insunits: number };
  /** Joins the far ends of the branch lines with a second cross main (a gridded system). */
  gridded?: boolean;
  /** A design area drawn on layer FP-AREA, as plan points (ft, in the unturned frame). */
  drawnArea?: Point[];
  /** Attributes added to every head. */
  headAttribs?: { tag: string; value: string }[];
  /** Moves the riser symbol off the end of the feed main by this much (ft). */
  sourceOffset?: Point;
  /** Rooms side by side, each piped from its own riser (default 1). */
  rooms?: number;
  /** Leaves out the piping (a layout before it is piped), or the riser symbol. */
  noPipes?: boolean;
  noSource?: boolean;
  /** Hazard-zone outlines on layer FP-ZONE (ft, in the unturned frame), each with its label text in the middle. */
  zones?: { outline: Point[]; label?: string }[];
}

export function layoutDxf(spec: LayoutSpec): string {
  const wa = spec.wallAlong ?? spec.s / 2;
  const wc = spec.wallAcross ?? spec.l / 2;
  const unit = spec.unit ?? { perFoot: 12, insunits: 1 };
  const rot = ((spec.rotationDeg ?? 0) * Math.PI) / 180;
  const off = spec.offset ?? { x: 0, y: 0 };
  const frame = (x: number, y: number): Point => ({
    x: (off.x + x * Math.cos(rot) - y * Math.sin(rot)) * unit.perFoot,
    y: (off.y + x * Math.sin(rot) + y * Math.cos(rot)) * unit.perFoot,
  });
  const width = 2 * wa + (spec.heads - 1) * spec.s;
  const height = 2 * wc + (spec.lines - 1) * spec.l;
  const mainX = Math.min(1, wa / 2);
  const w = new DxfWriter(unit.insunits);
  w.block('HEAD', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.25 * unit.perFoot, b);
  });
  w.block('RISER', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.5 * unit.perFoot, b);
  });
  // Each room is drawn again `rooms` times side by side, 20 ft apart, each with its own riser: one system each.
  for (let room = 0; room < (spec.rooms ?? 1); room++) {
    const shift = room * (width + 20);
    const tf = (x: number, y: number): Point => frame(x + shift, y);
    w.polyline('A-WALL', [tf(0, 0), tf(width, 0), tf(width, height), tf(0, height)], true);
    const midY = wc + Math.floor((spec.lines - 1) / 2) * spec.l + spec.l / 2;
    const pipe = spec.noPipes ? () => undefined : (a: Point, b: Point) => w.line('FP-PIPE', a, b);
    const label = spec.noPipes ? () => undefined : (at: Point, size: string) => w.text('FP-PIPE', at, 0.5 * unit.perFoot, size);
    if (!spec.noSource) w.insert('FP-SOURCE', 'RISER', tf(-8 + (spec.sourceOffset?.x ?? 0), midY + (spec.sourceOffset?.y ?? 0)));
    pipe(tf(-8, midY), tf(mainX, midY));
    label(tf(-6, midY + 0.3), '3"');
    pipe(tf(mainX, wc), tf(mainX, wc + (spec.lines - 1) * spec.l));
    label(tf(mainX + 0.4, wc + spec.l / 3), '2"');
    for (let j = 0; j < spec.lines; j++) {
      const y = wc + j * spec.l;
      const lastX = wa + (spec.heads - 1) * spec.s + (spec.gridded ? 1 : 0);
      pipe(tf(mainX, y), tf(lastX, y));
      label(tf((mainX + wa) / 2, y + 0.3), '1-1/4"');
      for (let i = 0; i < spec.heads; i++)
        w.insert('FP-HEAD', 'HEAD', tf(wa + i * spec.s, y), { rotation: spec.rotationDeg ?? 0, attribs: spec.headAttribs ?? [] });
    }
    if (spec.gridded) {
      const farX = wa + (spec.heads - 1) * spec.s + 1;
      pipe(tf(farX, wc), tf(farX, wc + (spec.lines - 1) * spec.l));
      label(tf(farX + 0.4, wc + spec.l / 3), '2"');
    }
  }
  if (spec.drawnArea)
    w.polyline(
      'FP-AREA',
      spec.drawnArea.map((q) => frame(q.x, q.y)),
      true,
    );
  for (const z of spec.zones ?? []) {
    w.polyline(
      'FP-ZONE',
      z.outline.map((q) => frame(q.x, q.y)),
      true,
    );
    const n = z.outline.length;
    const mid = { x: z.outline.reduce((s, q) => s + q.x, 0) / n, y: z.outline.reduce((s, q) => s + q.y, 0) / n };
    if (z.label !== undefined) w.text('FP-ZONE', frame(mid.x, mid.y), 1 * unit.perFoot, z.label);
  }
  for (const e of spec.extraHeads ?? []) {
    w.insert('FP-HEAD', 'HEAD', frame(e.x, e.y), { attribs: spec.headAttribs ?? [] });
  }
  return w.toString();
}

export const encode = (text: string): Uint8Array => new TextEncoder().encode(text);
