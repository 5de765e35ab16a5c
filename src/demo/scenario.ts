// The bundled demo (an invented scenario): "Alder Row Makerspace", a fictional ground floor: an ordinary-hazard
// (group 2) workshop of 96 ft × 58 ft, and a light-hazard office wing on a riser of its own; findings planted.

import type { Point } from '../geometry/point.js';
import { DxfWriter } from './dxf-writer.js';

const IN = 12; // drawn in inches
const p = (x: number, y: number): Point => ({ x: x * IN, y: y * IN });

/** The demo drawing as DXF text (R12, inches). */
export function demoDrawing(): string {
  const w = new DxfWriter(1)
    .layer('A-WALL', 8)
    .layer('A-GRID', 9)
    .layer('A-FURN', 252)
    .layer('FP-SPRK-HEAD', 1)
    .layer('FP-PIPE', 5)
    .layer('FP-PIPE-SIZE', 5)
    .layer('FP-RISER', 3)
    .layer('FP-REMOTE-AREA', 6)
    .layer('FP-HAZARD-ZONE', 4);
  w.block('SPK-PENDENT', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 4, b).line('0', { x: -4, y: 0 }, { x: 4, y: 0 }, b);
  });
  w.block('RISER-POC', { x: 0, y: 0 }, (b) => {
    w.circle('0', { x: 0, y: 0 }, 8, b).line('0', { x: -8, y: -8 }, { x: 8, y: 8 }, b);
  });
  w.block('BENCH', { x: 0, y: 0 }, (b) => {
    w.polyline('0', [p(0, 0), p(8, 0), p(8, 3), p(0, 3)], true, b);
  });

  // Architecture: room outline, column grid, benches.
  w.polyline('A-WALL', [p(0, 0), p(96, 0), p(96, 58), p(0, 58)], true);
  for (const x of [0, 24, 48, 72, 96]) w.line('A-GRID', p(x, -6), p(x, 64));
  for (const [x, y] of [
    [10, 8],
    [30, 8],
    [50, 18],
    [70, 28],
    [20, 38],
    [60, 48],
  ] as const)
    w.insert('A-FURN', 'BENCH', p(x, y));

  // Riser west of the room, 4" feed main to the middle of the 3" cross main, and a capped stub at its top end
  // (left unlabelled on purpose).
  w.insert('FP-RISER', 'RISER-POC', p(-10, 29));
  w.line('FP-PIPE', p(-10, 29), p(1.5, 29));
  w.text('FP-PIPE-SIZE', p(-6, 29.6), 6, '4"');
  w.polyline('FP-PIPE', [p(1.5, 4), p(1.5, 54)]);
  w.text('FP-PIPE-SIZE', p(2.2, 40), 6, '3"');
  w.line('FP-PIPE', p(1.5, 54), p(1.5, 57));

  // Six branch lines, heads 12 ft apart, lines 10 ft apart: 2" up to the fourth head, 1-1/2" beyond.
  const lines = [4, 14, 24, 34, 44, 54];
  for (const y of lines) {
    const xs = [6, 18, 30, 42, 54, 66, 78, 90].map((x) => (y === 34 && x === 78 ? 81 : x));
    if (y === 54) xs.push(94);
    w.line('FP-PIPE', p(1.5, y), p(42, y));
    w.text('FP-PIPE-SIZE', p(12, y + 0.6), 5, '2"');
    w.line('FP-PIPE', p(42, y), p(xs[xs.length - 1]!, y));
    w.text('FP-PIPE-SIZE', p(60, y + 0.6), 5, y === 14 ? '1 1/2"' : '1-1/2"');
    for (const x of xs) w.insert('FP-SPRK-HEAD', 'SPK-PENDENT', p(x, y), { attribs: [{ tag: 'K', value: '5.6' }] });
  }

  // The designer's design area at the far end.
  w.polyline('FP-REMOTE-AREA', [p(50, 25), p(96, 25), p(96, 58), p(50, 58)], true);

  officeWing(w);
  return w.toString();
}

/**
 * The office wing east of the workshop, 60 ft × 40 ft, a light-hazard zone on a riser of its own: a 3" feed main to
 * a 2" cross main along the east wall, four 1-1/4" branch lines of four heads 15 ft apart, 10 ft between lines.
 */
function officeWing(w: DxfWriter): void {
  w.polyline('A-WALL', [p(110, 0), p(170, 0), p(170, 40), p(110, 40)], true);
  w.polyline('FP-HAZARD-ZONE', [p(110, 0), p(170, 0), p(170, 40), p(110, 40)], true);
  w.text('FP-HAZARD-ZONE', p(122, 19), 12, 'OFFICE WING');
  w.insert('FP-RISER', 'RISER-POC', p(180, 20));
  w.line('FP-PIPE', p(180, 20), p(168.5, 20));
  w.text('FP-PIPE-SIZE', p(173, 20.6), 6, '3"');
  w.line('FP-PIPE', p(168.5, 5), p(168.5, 35));
  w.text('FP-PIPE-SIZE', p(166, 28), 6, '2"');
  for (const y of [5, 15, 25, 35]) {
    w.line('FP-PIPE', p(168.5, y), p(117.5, y));
    w.text('FP-PIPE-SIZE', p(155, y + 0.6), 5, '1-1/4"');
    for (const x of [117.5, 132.5, 147.5, 162.5])
      w.insert('FP-SPRK-HEAD', 'SPK-PENDENT', p(x, y), { attribs: [{ tag: 'K', value: '5.6' }] });
  }
}

/**
 * The demo's config: ordinary hazard group 2 at 0.20 gpm/ft² over 1500 ft², the office wing light hazard on its
 * curve's start point (0.10 gpm/ft² over 1500 ft²), one flow test for both risers.
 */
export const DEMO_CONFIG = {
  design: { hazard: 'OH2', density: 0.2, area: 1500, hoseAllowance: 250, systemType: 'wet', areaMode: 'both' },
  zones: { 'OFFICE*': { hazard: 'LH' } },
  defaults: { kFactor: 5.6, pipeSize: '1', cFactor: 120, schedule: '40', headElevation: 12, sourceElevation: 0 },
  supply: { static: 75, residual: 62, flow: 1200 },
} as const;
