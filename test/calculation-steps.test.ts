// The calculation a reviewer follows (`hydraulics.steps`, `hydraulics.heads`): walked from the controlling head to
// the source on the demo (tree, two risers) and on an ezdxf-written tree fixture, each step's friction recomputed
// here with the Hazen-Williams formula in the NFPA 13 form (p = 4.52·Q^1.85/(C^1.85·d^4.87) psi/ft: NFPA 13 (2019
// edition), 28.2.2.1, confirmed), pressures adding up to the source within 0.01 psi; EPANET (npm epanet-js) gives
// the same pressure at every flowing head within 1%.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseSettings } from '../src/config/settings.js';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { buildModel } from '../src/hydraulics/model.js';
import { checkText } from './support/check.js';
import { solveWithEpanet } from './support/epanet.js';

/** 0.433 psi per ft of water (TRADE.md: common practice). */
const PSI_PER_FT = 0.433;
const hazenWilliams = (q: number, c: number, d: number) => (4.52 * q ** 1.85) / (c ** 1.85 * d ** 4.87);

const drawings = [
  { name: 'demo', text: demoDrawing(), config: DEMO_CONFIG as unknown as Record<string, unknown> },
  {
    name: 'building-two-risers',
    text: readFileSync('fixtures/building-two-risers.dxf', 'latin1'),
    config: { supply: { static: 75, residual: 55, flow: 900 } },
  },
];

describe.each(drawings)('the calculation of $name', ({ text, config }) => {
  const r = checkText(text, config);
  const calculated = r.design.areas.filter((a) => a.hydraulics);

  it('every calculated area, the drawn one included, has its steps, its flowing heads and its controlling head', () => {
    expect(calculated.length).toBeGreaterThan(1);
    for (const a of r.report.designAreas.filter((x) => x.hydraulics)) {
      const h = a.hydraulics!;
      expect(h.steps.length).toBeGreaterThan(2);
      expect(h.heads.map((x) => x.handle).sort()).toEqual([...a.heads].sort());
      expect(a.heads).toContain(h.controllingHead);
    }
    if (r.plan.designAreas.length)
      expect(r.report.designAreas.find((a) => a.source === 'drawn')!.hydraulics!.steps.length).toBeGreaterThan(2);
  });

  it('each step: friction by Hazen-Williams over length + fittings, plus the rise, makes the next pressure; the last is the source (0.01 psi)', () => {
    for (const a of calculated) {
      const h = a.hydraulics!;
      const controlling = h.heads.find((x) => x.handle === h.controllingHead)!;
      // the controlling head gets exactly what it needs
      expect(controlling.pressure).toBeCloseTo(controlling.requiredPressure, 4);
      expect(h.steps[0]!.pressureFrom).toBeCloseTo(controlling.pressure, 6);
      const elevation = new Map(h.nodes.map((n) => [n.id, n.elevation]));
      let p = controlling.pressure;
      h.steps.forEach((s, i) => {
        const perFt = hazenWilliams(s.flow, s.cFactor, s.innerDiameter);
        expect(s.frictionPerLength).toBeCloseTo(perFt, 9);
        expect(s.friction).toBeCloseTo(perFt * (s.length + s.fittingsLength), 6);
        if (elevation.has(s.from) && elevation.has(s.to)) {
          expect(s.elevationChange).toBeCloseTo(PSI_PER_FT * (elevation.get(s.from)! - elevation.get(s.to)!), 9);
        }
        p += s.friction + s.elevationChange;
        expect(Math.abs(p - s.pressureTo), `step ${i + 1} (${s.pipe})`).toBeLessThan(0.01);
        if (i > 0) expect(s.pressureFrom).toBeCloseTo(h.steps[i - 1]!.pressureTo, 9);
      });
      expect(Math.abs(p - h.sourcePressure)).toBeLessThan(0.01);
    }
  });

  it('EPANET gives every flowing head its pressure within 1%', async () => {
    const settings = parseSettings(config);
    const byId = new Map(r.plan.heads.map((x) => [x.id, x]));
    for (const a of calculated) {
      const h = a.hydraulics!;
      const flowing = a.headIds.map((id) => ({
        head: byId.get(id)!,
        required: Math.max(7, ((a.basis.density * r.coverage.get(id)!.area!) / byId.get(id)!.kFactor) ** 2),
      }));
      const model = buildModel(r.network, r.network.systems.find((s) => s.id === a.system)!.sourceNodeId, flowing, settings);
      const e = await solveWithEpanet(model, h.sourcePressure);
      for (const head of h.heads)
        expect(Math.abs(e.pressure.get(head.node)! - head.pressure) / head.pressure, head.handle).toBeLessThan(0.01);
    }
  });
});
