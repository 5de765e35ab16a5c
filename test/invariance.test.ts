// Property tests (fast-check): moving and turning the whole drawing, or drawing it in inches, feet or
// millimetres, changes no finding — same rules, same heads, same measured values (common practice).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkText } from './support/check.js';
import { layoutDxf, type LayoutSpec } from '../src/demo/generated-layout.js';

const spec = fc.record({
  s: fc.double({ min: 7, max: 16, noNaN: true }),
  l: fc.double({ min: 7, max: 16, noNaN: true }),
  heads: fc.integer({ min: 2, max: 5 }),
  lines: fc.integer({ min: 2, max: 4 }),
  wallAlong: fc.double({ min: 0.2, max: 9, noNaN: true }),
  wallAcross: fc.double({ min: 0.2, max: 9, noNaN: true }),
});

/** Findings as comparable data: rule, severity and limit exactly, measured values sorted beside them. */
function signature(dxf: string) {
  const r = checkText(dxf, { defaults: { pipeSize: '1-1/4' } });
  const rows = r.findings.map((f) => ({ key: `${f.rule}|${f.severity}|${f.limit ?? '-'}`, measured: f.measured ?? 0 }));
  rows.sort((a, b) => a.key.localeCompare(b.key) || a.measured - b.measured);
  return rows;
}

function expectSame(a: ReturnType<typeof signature>, b: ReturnType<typeof signature>) {
  expect(a.map((x) => x.key)).toEqual(b.map((x) => x.key));
  a.forEach((x, i) => {
    expect(x.measured).toBeCloseTo(b[i]!.measured, 6);
  });
}

describe('invariance of the findings', () => {
  it('under moving and turning the whole drawing', () => {
    fc.assert(
      fc.property(spec, fc.double({ min: 0, max: 360, noNaN: true }), fc.double({ min: -5000, max: 5000, noNaN: true }), (s, rot, dx) => {
        const base = signature(layoutDxf(s as LayoutSpec));
        const moved = signature(layoutDxf({ ...s, rotationDeg: rot, offset: { x: dx, y: -dx / 3 } }));
        expectSame(moved, base);
      }),
      { numRuns: 40 },
    );
  });

  it('under drawing units: inches, feet and millimetres ($INSUNITS 1, 2, 4)', () => {
    fc.assert(
      fc.property(spec, (s) => {
        const inches = signature(layoutDxf({ ...s, unit: { perFoot: 12, insunits: 1 } }));
        expectSame(signature(layoutDxf({ ...s, unit: { perFoot: 1, insunits: 2 } })), inches);
        expectSame(signature(layoutDxf({ ...s, unit: { perFoot: 304.8, insunits: 4 } })), inches);
      }),
      { numRuns: 30 },
    );
  });
});
