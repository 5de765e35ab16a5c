// The design-area search: pruning (the bound on trees, proving solves on any network) never drops the true
// most demanding area or its runner-up (property test against brute force, trees and grids); the shape rules
// place the remainder heads at the cross-main end of the next line (common practice).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkLayout } from '../../test/support/check.js';
import { parseSettings } from '../config/settings.js';
import { candidatesOf, lineFamilies } from './candidates.js';
import { designBasis } from '../basis/design-basis.js';
import { searchMostDemanding } from './search.js';
import { treeBound } from '../hydraulics/k-factor-walk.js';
import { buildModel } from '../hydraulics/model.js';
import { calculateArea } from '../hydraulics/calculate.js';

function searchBoth(spec: Parameters<typeof checkLayout>[0], config: Record<string, unknown>) {
  const r = checkLayout(spec, config);
  const settings = parseSettings(config);
  const basis = designBasis(settings.design);
  const areaOf = (id: string) => r.coverage.get(id)!.area!;
  const fam = lineFamilies(r.network, r.network.branchLines, r.plan.heads, r.coverage, basis.area)[0]!;
  const source = r.network.systems[0]!.sourceNodeId;
  const cands = candidatesOf(fam, areaOf, basis.area);
  const byId = new Map(r.plan.heads.map((h) => [h.id, h]));
  const flowingOf = (ids: string[]) =>
    ids.map((id) => ({ head: byId.get(id)!, required: Math.max(7, ((basis.density * areaOf(id)) / byId.get(id)!.kFactor) ** 2) }));
  const pruned = searchMostDemanding(r.network, source, cands, flowingOf, settings, basis.hoseAllowance);
  const brute = searchMostDemanding(r.network, source, cands, flowingOf, settings, basis.hoseAllowance, { prune: false });
  return { pruned, brute, r };
}

describe('design-area search', () => {
  it('pruning never drops the most demanding area or the runner-up (brute force on random trees and grids)', () => {
    fc.assert(
      fc.property(
        fc.record({
          s: fc.double({ min: 8, max: 13, noNaN: true }),
          l: fc.double({ min: 8, max: 12, noNaN: true }),
          heads: fc.integer({ min: 3, max: 8 }),
          lines: fc.integer({ min: 2, max: 6 }),
          area: fc.integer({ min: 300, max: 1500 }),
          supply: fc.boolean(),
          gridded: fc.boolean(),
        }),
        (p) => {
          const config = {
            design: { density: 0.2, area: p.area },
            defaults: { headElevation: 10, sourceElevation: 0 },
            ...(p.supply ? { supply: { static: 90, residual: 70, flow: 1000 } } : {}),
          };
          const { pruned, brute } = searchBoth({ s: p.s, l: p.l, heads: p.heads, lines: p.lines, gridded: p.gridded }, config);
          expect(brute.evaluated).toBe(brute.candidates);
          // equal to the pressure search's tolerance (1e-6 psi; warm starts differ between the two runs)
          expect(pruned.best!.score).toBeCloseTo(brute.best!.score, 4);
          if (brute.runnerUp) expect(pruned.runnerUp!.score).toBeCloseTo(brute.runnerUp.score, 4);
          expect(pruned.evaluated).toBeLessThanOrEqual(brute.evaluated);
        },
      ),
      { numRuns: 40 },
    );
  });

  it('the bound is never below the exact demand (every candidate of random trees)', () => {
    fc.assert(
      fc.property(
        fc.record({
          s: fc.double({ min: 8, max: 13, noNaN: true }),
          heads: fc.integer({ min: 3, max: 7 }),
          lines: fc.integer({ min: 2, max: 5 }),
          area: fc.integer({ min: 300, max: 1500 }),
        }),
        (p) => {
          const config = { design: { density: 0.2, area: p.area } };
          const r = checkLayout({ s: p.s, l: 10, heads: p.heads, lines: p.lines }, config);
          const settings = parseSettings(config);
          const basis = designBasis(settings.design);
          const source = r.network.systems[0]!.sourceNodeId;
          const areaOf = (id: string) => r.coverage.get(id)!.area!;
          const byId = new Map(r.plan.heads.map((h) => [h.id, h]));
          const flowingOf = (ids: string[]) =>
            ids.map((id) => ({ head: byId.get(id)!, required: Math.max(7, ((0.2 * areaOf(id)) / 5.6) ** 2) }));
          const bound = treeBound(buildModel(r.network, source, flowingOf(r.plan.heads.map((h) => h.id)), settings))!;
          const fam = lineFamilies(r.network, r.network.branchLines, r.plan.heads, r.coverage, basis.area)[0]!;
          for (const c of candidatesOf(fam, areaOf, basis.area)) {
            const exact = calculateArea(r.network, source, flowingOf(c.headIds), settings, 0);
            const b = bound.bound(c.headIds)!;
            expect(b.pressure).toBeGreaterThanOrEqual(exact.sourcePressure - 1e-6);
            expect(b.flow).toBeGreaterThanOrEqual(exact.sourceFlow - 1e-6);
            expect(b.pressure).toBeLessThan(exact.sourcePressure * 1.05); // and it is tight
          }
        },
      ),
      { numRuns: 15 },
    );
  });

  for (const gridded of [false, true]) {
    it(`prunes on a larger ${gridded ? 'grid' : 'tree'}: 10 lines of 12 heads, few areas calculated, fewer solves than brute force`, () => {
      const config = { design: { density: 0.2, area: 1500 }, supply: { static: 90, residual: 70, flow: 1000 } };
      const { pruned, brute } = searchBoth({ s: 12, l: 10, heads: 12, lines: 10, gridded }, config);
      expect(pruned.best!.score).toBeCloseTo(brute.best!.score, 4);
      expect(pruned.runnerUp!.score).toBeCloseTo(brute.runnerUp!.score, 4);
      expect(pruned.evaluated).toBeLessThan(brute.evaluated / 4);
      expect(pruned.solves).toBeLessThan(brute.solves / 2);
    });
  }

  it('1500 ft² at 12 × 10 ft: 4 heads along, 13 heads, the 13th on the next line at the cross-main end', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 8, lines: 6 }, { design: { density: 0.2, area: 1500 } });
    const best = r.design.areas.find((a) => a.rank === 'most-demanding')!;
    expect(r.design.groups[0]!.shape).toMatchObject({ headsAlong: 4, totalHeads: 13, fullLines: 3, remainder: 1 });
    expect(best.headIds).toHaveLength(13);
    expect(best.lineIds).toHaveLength(4);
    // the remote end is the far end of the lines (x = 42..78); the 13th head is the one nearest the cross main
    const xs = best.headIds.map((id) => r.plan.heads.find((h) => h.id === id)!.position.x);
    const counts = new Map<number, number>();
    for (const id of best.headIds) {
      const line = r.network.branchLines.find((b) => b.headIds.includes(id))!.id;
      counts.set(Number(line.slice(1)), (counts.get(Number(line.slice(1))) ?? 0) + 1);
    }
    expect([...counts.values()].sort()).toEqual([1, 4, 4, 4]);
    expect(Math.max(...xs)).toBe(90);
    const lone = best.headIds.find(
      (id) => counts.get(Number(r.network.branchLines.find((b) => b.headIds.includes(id))!.id.slice(1))) === 1,
    )!;
    expect(r.plan.heads.find((h) => h.id === lone)!.position.x).toBe(54);
    expect(best.length).toBeCloseTo(48, 9);
    expect(best.actualArea).toBeCloseTo(13 * 120, 9);
  });
});
