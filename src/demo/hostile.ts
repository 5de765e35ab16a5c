// Hostile drawings for the tests and the benchmark: small files whose blocks multiply into millions of entities
// (arrays, nesting), a head block arrayed into a dense field, a wall of a hundred thousand vertices. Each must end
// in a one-line refusal or a report, never a hang, exhausted memory or a crash.

import type { Point } from '../geometry/point.js';
import { DxfWriter } from './dxf-writer.js';

const square = (x: number, y: number, size: number): Point[] => [
  { x, y },
  { x: x + size, y },
  { x: x + size, y: y + size },
  { x, y: y + size },
];

/** A pipe, a riser and a room, so that the drawing is otherwise a plan (feet). */
function plan(w: DxfWriter): DxfWriter {
  w.block('RISER', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 0.5, b);
  });
  w.polyline('A-WALL', square(0, 0, 60), true);
  w.insert('FP-SOURCE', 'RISER', { x: -8, y: 30 });
  w.line('FP-PIPE', { x: -8, y: 30 }, { x: 50, y: 30 });
  return w;
}

export const HOSTILE: Record<string, { what: string; dxf: () => string }> = {
  'polyline-block-array': {
    what: 'a block of 10 polylines placed 1000 × 1000 times by one MINSERT, on the wall layer',
    dxf: () => {
      const w = new DxfWriter(2);
      w.block('TILE', { x: 0, y: 0 }, (b) => {
        for (let i = 0; i < 10; i++) w.polyline('0', square(i, 0, 0.5), true, b);
      });
      w.insert('A-WALL', 'TILE', { x: 0, y: 0 }, { grid: { columns: 1000, rows: 1000, columnSpacing: 1, rowSpacing: 1 } });
      return plan(w).toString();
    },
  },
  'nested-fan-out': {
    what: 'blocks nested eight deep, each placing the next ten times (10^8 polylines), on the pipe layer',
    dxf: () => {
      const w = new DxfWriter(2);
      w.block('L8', { x: 0, y: 0 }, (b) => {
        w.polyline('0', square(0, 0, 0.1), true, b);
      });
      for (let d = 7; d >= 0; d--)
        w.block(`L${d}`, { x: 0, y: 0 }, (b) => {
          for (let i = 0; i < 10; i++) w.insert('0', `L${d + 1}`, { x: i, y: 0 }, { into: b });
        });
      w.insert('FP-PIPE', 'L0', { x: 0, y: 0 });
      return plan(w).toString();
    },
  },
  'head-array-1000': {
    what: 'one head block arrayed 1000 × 1000 by a MINSERT on the head layer',
    dxf: () => {
      const w = new DxfWriter(2);
      w.block('HEAD', { x: 0, y: 0 }, (b) => {
        w.circle('0', { x: 0, y: 0 }, 0.25, b);
      });
      w.insert('FP-HEAD', 'HEAD', { x: 0, y: 0 }, { grid: { columns: 1000, rows: 1000, columnSpacing: 0.5, rowSpacing: 0.5 } });
      return plan(w).toString();
    },
  },
  'head-array-100': {
    what: 'one head block arrayed 100 × 100 at 6 in, a field of ten thousand heads packed too close',
    dxf: () => {
      const w = new DxfWriter(2);
      w.block('HEAD', { x: 0, y: 0 }, (b) => {
        w.circle('0', { x: 0, y: 0 }, 0.25, b);
      });
      w.insert('FP-HEAD', 'HEAD', { x: 1, y: 1 }, { grid: { columns: 100, rows: 100, columnSpacing: 0.5, rowSpacing: 0.5 } });
      return plan(w).toString();
    },
  },
  'long-wall': {
    what: 'a room outline of 130,000 vertices beside a small layout',
    dxf: () => {
      const w = new DxfWriter(2);
      const n = 130_000;
      const pts = Array.from({ length: n }, (_, i) => {
        const a = (2 * Math.PI * i) / n;
        return { x: 30 + 40 * Math.cos(a), y: 30 + 40 * Math.sin(a) };
      });
      w.polyline('A-WALL', pts, true);
      w.block('HEAD', { x: 0, y: 0 }, (b) => {
        w.circle('0', { x: 0, y: 0 }, 0.25, b);
      });
      for (let i = 0; i < 4; i++) w.insert('FP-HEAD', 'HEAD', { x: 10 + i * 10, y: 30 });
      return plan(w).toString();
    },
  },
};
