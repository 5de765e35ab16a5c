// The design-area search: pruning (the bound on trees, proving solves on any network) never drops the true
// most demanding area or its runner-up (property test against brute force, trees and grids); the shape rules
// place the remainder heads at the cross-main end of the next line (common practice).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkLayout } from '../../test/support/check.js';
import { parseSettings } from '../config/settings.js';
import { candidateGroupsOf, lastRun, lineFamilies, membersOf } from './candidates.js';
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
  const cands = candidateGroupsOf(fam, areaOf, basis.area);
  const byId = new Map(r.plan.heads.map((h) => [h.id, h]));
  const flowingOf = (ids: string[]) =>
    ids.map((id) => ({ head: byId.get(id)!, required: Math.max(7, ((basis.density * areaOf(id)) / byId.get(id)!.kFactor) ** 2) }));
  const pruned = searchMostDemanding(r.network, source, cands, flowingOf, settings, basis.hoseAllowance);
  const brute = searchMostDemanding(r.network, source, cands, flowingOf, settings, basis.hoseAllowance, { prune: false });
  return { pruned, brute, r };
}

describe('design-area search', () => {
  it('pruning never drops the most demanding area or the runner-up (brute force on random trees and grids, supplies through random paths)', () => {
    fc.assert(
      fc.property(
        fc.record({
          s: fc.double({ min: 8, max: 13, noNaN: true }),
          l: fc.double({ min: 8, max: 12, noNaN: true }),
          heads: fc.integer({ min: 3, max: 8 }),
          lines: fc.integer({ min: 2, max: 6 }),
          area: fc.integer({ min: 300, max: 1500 }),
          supply: fc.constantFrom('none', 'test', 'path', 'rising pump'),
          gridded: fc.boolean(),
          // A supply path's parts (CONTRACT.md, Supply path): pipe, device and pump laws with random curves.
          pipeLength: fc.integer({ min: 20, max: 600 }),
          rise: fc.double({ min: -5, max: 5, noNaN: true }),
          deviceLoss: fc.tuple(fc.double({ min: 1, max: 8, noNaN: true }), fc.double({ min: 0, max: 8, noNaN: true })),
          pumpCurve: fc.tuple(
            fc.double({ min: 20, max: 80, noNaN: true }),
            fc.double({ min: 0, max: 10, noNaN: true }),
            fc.double({ min: 0, max: 30, noNaN: true }),
          ),
        }),
        (p) => {
          const [lossAt0, lossRise] = p.deviceLoss;
          const [churn, drop, fall] = p.pumpCurve;
          const path = [
            { type: 'pipe', length: p.pipeLength, size: '6', rise: p.rise },
            {
              type: 'device',
              name: 'backflow preventer',
              loss: [
                [0, lossAt0],
                [800, lossAt0 + lossRise],
              ],
            },
            p.supply === 'rising pump'
              ? {
                  type: 'pump',
                  name: 'pump rising near churn',
                  curve: [
                    [0, churn],
                    [300, churn + 5],
                    [1500, Math.max(0, churn - fall)],
                  ],
                }
              : {
                  type: 'pump',
                  name: 'fire pump',
                  curve: [
                    [0, churn],
                    [600, churn - drop],
                    [1500, Math.max(0, churn - drop - fall)],
                  ],
                },
          ];
          const supply = { static: 90, residual: 70, flow: 1000, ...(p.supply === 'test' ? {} : { path }) };
          const config = {
            design: { density: 0.2, area: p.area },
            defaults: { headElevation: 10, sourceElevation: 0 },
            ...(p.supply === 'none' ? {} : { supply }),
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

  it('the bounds are never below the exact demand (every candidate of random trees, and each group of them)', () => {
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
          const groups = candidateGroupsOf(fam, areaOf, basis.area);
          bound.knowLines(fam.lines.map((l) => l.ids));
          for (const g of groups) {
            // one bound for every placement of the group's leftover, summed window by window as the search does:
            // above each one's exact demand
            const any = bound.boundOfGroup(
              g.base,
              g.next && { heads: g.next.heads, first: g.next.first, last: lastRun(g), size: g.next.size },
            )!;
            for (const c of membersOf(g)) {
              const exact = calculateArea(r.network, source, flowingOf(c.headIds), settings, 0);
              const b = bound.bound(c.headIds)!;
              expect(b.pressure).toBeGreaterThanOrEqual(exact.sourcePressure - 1e-6);
              expect(b.flow).toBeGreaterThanOrEqual(exact.sourceFlow - 1e-6);
              expect(b.pressure).toBeLessThan(exact.sourcePressure * 1.05); // and it is tight
              expect(any.pressure).toBeGreaterThanOrEqual(b.pressure - 1e-6);
              expect(any.flow).toBeGreaterThanOrEqual(b.flow - 1e-6);
            }
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

  it('1500 ft² at 12 × 10 ft: 4 heads along, 13 heads; the 13th at the cross-main end of the next line is the most demanding', () => {
    // Lines of 8 heads at x = 6..90 ft fed from a cross main at x = 1 ft; the remote rectangle is x = 54..90.
    const config = { design: { density: 0.2, area: 1500 } };
    const r = checkLayout({ s: 12, l: 10, heads: 8, lines: 6 }, config);
    const best = r.design.areas.find((a) => a.rank === 'most-demanding')!;
    expect(r.design.groups[0]!.shape).toMatchObject({ headsAlong: 4, totalHeads: 13, fullLines: 3, remainder: 1 });
    expect(best.headIds).toHaveLength(13);
    expect(best.lineIds).toHaveLength(4);
    const at = (id: string) => r.plan.heads.find((h) => h.id === id)!.position;
    const lineOf = (id: string) => r.network.branchLines.find((b) => b.headIds.includes(id))!.id;
    const perLine = new Map<string, string[]>();
    for (const id of best.headIds) perLine.set(lineOf(id), [...(perLine.get(lineOf(id)) ?? []), id]);
    expect([...perLine.values()].map((ids) => ids.length).sort()).toEqual([1, 4, 4, 4]);
    const lone = [...perLine.values()].find((ids) => ids.length === 1)![0]!;
    expect(at(lone).x).toBe(6);
    expect(best.length).toBeCloseTo(48, 9);
    expect(best.actualArea).toBeCloseTo(13 * 120, 9);
    // Every other place of the 13th head on its line, calculated on its own, asks less of the source: under the
    // rectangle (x = 54) 0.04 psi less (common practice names the cross-main end; here it is also the most demanding).
    const settings = parseSettings(config);
    const whole = best.headIds.filter((id) => id !== lone);
    const source = r.network.systems[0]!.sourceNodeId;
    const pressureWith = (x: number) => {
      const h = r.plan.heads.find((q) => q.position.x === x && q.position.y === at(lone).y)!;
      const ids = [...whole, h.id];
      const flowing = ids.map((id) => ({ head: r.plan.heads.find((q) => q.id === id)!, required: ((0.2 * 120) / 5.6) ** 2 }));
      return calculateArea(r.network, source, flowing, settings, 0).sourcePressure;
    };
    const elsewhere = [18, 30, 42, 54, 66, 78, 90].map(pressureWith);
    expect(pressureWith(6)).toBeCloseTo(best.hydraulics!.sourcePressure, 4);
    for (const p of elsewhere) expect(p).toBeLessThan(best.hydraulics!.sourcePressure - 1e-4);
    expect(best.hydraulics!.sourcePressure - pressureWith(54)).toBeCloseTo(0.04, 2);
  });

  it('the family holds every place of the leftover heads: the cross-main end, under the rectangle and between', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 8, lines: 6 }, { design: { density: 0.2, area: 1500 } });
    const fam = lineFamilies(r.network, r.network.branchLines, r.plan.heads, r.coverage, 1500)[0]!;
    const groups = candidateGroupsOf(fam, (id) => r.coverage.get(id)!.area!, 1500);
    // the start at x = 54 on the first line, going across: 12 heads on three lines, the 13th anywhere on the
    // fourth line from its cross-main end (x = 6) to the rectangle's far side (x = 90)
    const g = groups.find(
      (x) =>
        x.base.length === 12 &&
        x.base.every((id) => r.plan.heads.find((h) => h.id === id)!.position.x >= 54) &&
        x.lines[0] === fam.lines[0]!.id,
    )!;
    const xs = membersOf(g).map((c) => r.plan.heads.find((h) => h.id === c.headIds[12])!.position.x);
    expect(xs).toEqual([6, 18, 30, 42, 54, 66, 78, 90]);
    // no two groups share their whole lines and next line
    const keys = groups.map((x) => `${[...x.base].sort().join()}|${x.next?.line}`);
    expect(new Set(keys).size).toBe(keys.length);
  });
});
