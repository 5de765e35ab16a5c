// The demo's design areas (drawn and searched) recomputed by EPANET (npm epanet-js) on the same network:
// source flow and every node pressure within 1%; the classic hand method within 1% of the network solution.

import { describe, expect, it } from 'vitest';
import { parseSettings } from '../src/config/settings.js';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { buildModel } from '../src/hydraulics/model.js';
import { checkText } from './support/check.js';
import { solveWithEpanet } from './support/epanet.js';

describe('demo design areas against EPANET', () => {
  const r = checkText(demoDrawing(), DEMO_CONFIG as unknown as Record<string, unknown>);
  const settings = parseSettings(DEMO_CONFIG);
  const byId = new Map(r.plan.heads.map((h) => [h.id, h]));

  const labelOf = (a: (typeof r.design.areas)[number]) => `${a.rank ?? a.source} ${a.zone === null ? 'workshop' : 'office wing'}`;
  const labels = ['drawn workshop', 'most-demanding workshop', 'runner-up workshop', 'most-demanding office wing', 'runner-up office wing'];

  it('has a drawn area and the searched most demanding area and runner-up of the workshop, and of the office wing', () => {
    expect(r.design.areas.map(labelOf)).toEqual(labels);
  });

  for (const label of labels) {
    it(`${label}: EPANET at the reported source pressure gives the same flow and pressures (1%)`, async () => {
      const area = r.design.areas.find((a) => labelOf(a) === label)!;
      const h = area.hydraulics!;
      const flowing = area.headIds.map((id) => ({
        head: byId.get(id)!,
        required: Math.max(7, ((area.basis.density * r.coverage.get(id)!.area!) / byId.get(id)!.kFactor) ** 2),
      }));
      const model = buildModel(r.network, r.network.systems.find((x) => x.id === area.system)!.sourceNodeId, flowing, settings);
      const e = await solveWithEpanet(model, h.sourcePressure);
      expect(Math.abs(e.sourceFlow - h.sourceFlow) / h.sourceFlow).toBeLessThan(0.01);
      const source = model.nodes[model.source]!.id;
      for (const n of h.nodes.filter((x) => x.id !== source)) {
        expect(Math.abs(e.pressure.get(n.id)! - n.pressure) / h.sourcePressure).toBeLessThan(0.01);
      }
      // the classic hand method (K-factor balancing) is an approximation of the same tree: within 1%
      expect(Math.abs(h.handMethod!.sourcePressure - h.sourcePressure) / h.sourcePressure).toBeLessThan(0.01);
      expect(Math.abs(h.handMethod!.sourceFlow - h.sourceFlow) / h.sourceFlow).toBeLessThan(0.01);
    });
  }

  it('reports the contract fields for each area', () => {
    for (const a of r.report.designAreas) {
      for (const k of ['source', 'density', 'area', 'minLength', 'length', 'width', 'actualArea', 'heads', 'hydraulics'])
        expect(a).toHaveProperty(k);
      for (const k of ['sourcePressure', 'sourceFlow', 'hoseAllowance', 'totalDemand', 'supplyAvailable', 'margin', 'nodes', 'pipes'])
        expect(a.hydraulics).toHaveProperty(k);
      // the riser rises from the supply at 0 ft to the piping at 12 ft; its size is its feed main's: 4" and 3"
      expect(a.hydraulics!.riser).toEqual({ modelled: 'virtual', length: 12, nominalSize: a.zone === null ? '4' : '3' });
    }
  });
});
