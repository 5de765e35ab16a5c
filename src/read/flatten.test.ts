// Block expansion limits and rules of the DXF reference: a block that contains itself and nesting past
// the limit are clear errors, not hangs; entities on layer 0 inside a block take the reference's layer.

import { describe, expect, it } from 'vitest';
import { DEFAULT_INPUT_LIMITS } from '../config/settings.js';
import { DxfWriter } from '../demo/dxf-writer.js';
import { InputError } from '../input-error.js';
import { readDrawing } from './read-drawing.js';

const bytes = (s: string) => new TextEncoder().encode(s);

describe('block expansion', () => {
  it('stops a block that references itself with a clear error', () => {
    const w = new DxfWriter(2);
    w.block('LOOP', { x: 0, y: 0 }, (b) => {
      w.insert('0', 'LOOP', { x: 1, y: 0 }, { into: b });
    });
    w.insert('HEADS', 'LOOP', { x: 0, y: 0 });
    expect(() => readDrawing(bytes(w.toString()))).toThrow(/block "LOOP" contains a reference to itself/);
  });

  it('stops nesting past the depth limit', () => {
    const w = new DxfWriter(2);
    for (let i = 0; i < 5; i++)
      w.block(`B${i}`, { x: 0, y: 0 }, (b) => {
        if (i < 4) w.insert('0', `B${i + 1}`, { x: 1, y: 0 }, { into: b });
      });
    w.insert('X', 'B0', { x: 0, y: 0 });
    expect(() => readDrawing(bytes(w.toString()), { limits: { ...DEFAULT_INPUT_LIMITS, blockDepth: 3, blockReferences: 100 } })).toThrow(
      /nesting deeper than 3/,
    );
    expect(
      readDrawing(bytes(w.toString()), {
        layers: { heads: ['X'] },
        limits: { ...DEFAULT_INPUT_LIMITS, blockDepth: 8, blockReferences: 100 },
      }).refs,
    ).toHaveLength(5);
  });

  it('stops an expansion past the reference limit (nested arrays must not explode memory)', () => {
    const w = new DxfWriter(2);
    w.block('LEAF', { x: 0, y: 0 }, (b) => {
      w.circle('0', { x: 0, y: 0 }, 1, b);
    });
    w.block('TEN', { x: 0, y: 0 }, (b) => {
      for (let i = 0; i < 10; i++) w.insert('0', 'LEAF', { x: i, y: 0 }, { into: b });
    });
    for (let i = 0; i < 10; i++) w.insert('X', 'TEN', { x: 0, y: i });
    expect(() =>
      readDrawing(bytes(w.toString()), {
        layers: { heads: ['X'] },
        limits: { ...DEFAULT_INPUT_LIMITS, blockDepth: 8, blockReferences: 50 },
      }),
    ).toThrow(InputError);
  });

  it('gives layer-0 entities inside a block the reference layer, and keeps the top-level handle', () => {
    const w = new DxfWriter(2);
    w.block('SYM', { x: 0, y: 0 }, (b) => {
      w.line('0', { x: 0, y: 0 }, { x: 1, y: 0 }, b).line('OWN', { x: 0, y: 0 }, { x: 0, y: 1 }, b);
    });
    w.insert('FP-HEAD', 'SYM', { x: 10, y: 10 });
    const d = readDrawing(bytes(w.toString()), { layers: { heads: ['FP-HEAD'], pipes: ['FP-HEAD', 'OWN'] } });
    expect(d.strokes.map((s) => s.layer).sort()).toEqual(['FP-HEAD', 'OWN']);
    expect(new Set(d.strokes.map((s) => s.handle)).size).toBe(1);
    expect(d.strokes.map((s) => s.handle)[0]).toBe(d.refs[0]!.handle);
  });

  it('needs the drawing unit when $INSUNITS is unitless', () => {
    const w = new DxfWriter(0);
    w.line('P', { x: 0, y: 0 }, { x: 1, y: 0 });
    expect(() => readDrawing(bytes(w.toString()))).toThrow(/set "units" in the config/);
    expect(readDrawing(bytes(w.toString()), { units: 'mm', layers: { pipes: ['P'] } }).strokes[0]!.length).toBeCloseTo(1 / 304.8, 12);
  });
});
