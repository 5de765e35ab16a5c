// The hydraulic calculation against hand-worked numbers and against EPANET (npm epanet-js), an
// independent solver, on a tree and a grid, within the 1% the Hazen-Williams exponents allow (1.85 vs 1.852).

import { describe, expect, it } from 'vitest';
import { parseSettings } from '../config/settings.js';
import { checkLayout } from '../../test/support/check.js';
import { EPANET_PSI_PER_FT, solveWithEpanet } from '../../test/support/epanet.js';
import { AreaCalculator, calculateArea } from './calculate.js';
import { frictionPsiPerFt, resistance } from './hazen-williams.js';
import { buildModel, type HydraulicModel } from './model.js';
import { modelPipe } from '../../test/support/model-pipe.js';
import { NetworkSolver } from './solver.js';
import { availablePressure, flowAtZeroPressure } from './water-supply.js';

const onePipe = (): HydraulicModel => ({
  nodes: [
    { id: 'S', elevation: 0 },
    { id: 'H', elevation: 0 },
  ],
  pipes: [
    {
      id: 'P',
      from: 0,
      to: 1,
      length: 100,
      fittingsLength: 0,
      fittings: [],
      nominalSize: '1',
      diameter: 1.049,
      c: 120,
      r: resistance(100, 120, 1.049),
      run: 0,
    },
  ],
  emitters: [{ node: 1, headId: 'H1', k: 5.6, required: 7 }],
  source: 0,
  riser: { modelled: 'none', length: 0, nominalSize: '1' },
});

describe('Hazen-Williams and the supply curve', () => {
  it('friction of 24 gpm in 1 in Schedule 40 at C 120: 4.52·24^1.85/(120^1.85·1.049^4.87) = 0.18233 psi/ft', () => {
    // the formula as NFPA 13 (2019 edition) 28.2.2.1 gives it (confirmed), evaluated independently with
    // Python's math module: 0.182334
    expect(frictionPsiPerFt(24, 120, 1.049)).toBeCloseTo(0.182334, 5);
  });
  it('a flow test 80 static / 60 residual at 1000 gpm leaves 80 − 20·0.5^1.85 = 74.45 psi at 500 gpm (NFPA 291 form, confirmed)', () => {
    expect(availablePressure({ static: 80, residual: 60, flow: 1000 }, 500)).toBeCloseTo(80 - 20 * 0.5 ** 1.85, 9);
    expect(availablePressure({ static: 80, residual: 60, flow: 1000 }, 1000)).toBeCloseTo(60, 9);
  });
  it('the same test reaches zero at 1000·4^(1/1.85) = 2115.6 gpm and gives nothing beyond (a supply cannot give negative pressure)', () => {
    const test = { static: 80, residual: 60, flow: 1000 };
    // 80 − 20·(Q/1000)^1.85 = 0 ⇔ Q = 1000·(80/20)^(1/1.85), evaluated with Python's math module: 2115.62
    expect(flowAtZeroPressure(test)).toBeCloseTo(2115.62, 1);
    expect(availablePressure(test, 2115.62)).toBeCloseTo(0, 2);
    expect(availablePressure(test, 3000)).toBe(0);
    expect(flowAtZeroPressure({ static: 60, residual: 60, flow: 500 })).toBe(Number.POSITIVE_INFINITY);
  });
});

describe('network solver', () => {
  it('one 1 in pipe, 100 ft, C 120, K 5.6, source head 150 ft: 33.343 psi and 32.336 gpm (bisection with the NFPA 13 Hazen-Williams formula, common practice)', () => {
    const solver = new NetworkSolver(onePipe());
    const s = solver.expand(solver.solve(150 * EPANET_PSI_PER_FT));
    expect(s.pressure[1]).toBeCloseTo(33.343, 2);
    expect(s.emitterFlow[0]).toBeCloseTo(32.336, 2);
  });

  it('agrees with EPANET on the same pipe (EPANET 2.2 via epanet-js measured 33.339 psi, 32.334 gpm)', async () => {
    const e = await solveWithEpanet(onePipe(), 150 * EPANET_PSI_PER_FT);
    expect(e.pressure.get('H')).toBeCloseTo(33.339, 2);
    expect(e.emitterFlow.get('H1')).toBeCloseTo(32.334, 2);
  });

  it('a hand-worked two-head tree: end head at 18.37 psi, then upstream step by step', () => {
    // Source —10 ft— H1 —12 ft— H2, 1 in Schedule 40 (1.049 in), C 120, K 5.6; no fittings, no elevation.
    // Each head needs 0.20 gpm/ft² × 120 ft² = 24 gpm (density × protection area; common practice worked example).
    const p2 = (24 / 5.6) ** 2; // 18.367 psi at the end head
    const lossB = 12 * frictionPsiPerFt(24, 120, 1.049); // H1 → H2 carries 24 gpm
    const p1 = p2 + lossB;
    const q1 = 5.6 * Math.sqrt(p1); // H1 flows more than 24 gpm: it sees more pressure
    const lossA = 10 * frictionPsiPerFt(24 + q1, 120, 1.049);
    const pSource = p1 + lossA;
    const model: HydraulicModel = {
      nodes: [
        { id: 'S', elevation: 0 },
        { id: 'N1', elevation: 0 },
        { id: 'N2', elevation: 0 },
      ],
      pipes: [
        { ...modelPipe(0, 1, resistance(10, 120, 1.049)), id: 'A' },
        { ...modelPipe(1, 2, resistance(12, 120, 1.049)), id: 'B', length: 12 },
      ],
      emitters: [
        { node: 1, headId: 'H1', k: 5.6, required: p2 },
        { node: 2, headId: 'H2', k: 5.6, required: p2 },
      ],
      source: 0,
      riser: { modelled: 'none', length: 0, nominalSize: '1' },
    };
    const solver = new NetworkSolver(model);
    const s = solver.expand(solver.solve(pSource));
    expect(s.pressure[2]).toBeCloseTo(p2, 6);
    expect(s.pressure[1]).toBeCloseTo(p1, 6);
    expect(s.emitterFlow[0]).toBeCloseTo(q1, 6);
    expect(s.flow[0]).toBeCloseTo(24 + q1, 6);
    // the same steps evaluated independently in Python: 18.367 psi, 20.555 psi, 25.389 gpm, 27.485 psi at the source
    expect([p2, p1, q1, pSource].map((v) => Number(v.toFixed(3)))).toEqual([18.367, 20.555, 25.389, 27.485]);
  });
});

describe('design-area hydraulics against EPANET', () => {
  const settings = parseSettings({ defaults: { headElevation: 0, sourceElevation: 0 }, design: { density: 0.2 } });
  for (const gridded of [false, true]) {
    it(`${gridded ? 'grid' : 'tree'}: source pressure and flow and every node pressure within 1%`, async () => {
      const r = checkLayout({ s: 12, l: 10, heads: 5, lines: 4, gridded }, { defaults: { headElevation: 0, sourceElevation: 0 } });
      expect(r.network.systems[0]!.topology).toBe(gridded ? 'grid' : 'tree');
      const source = r.network.systems[0]!.sourceNodeId;
      const flowing = r.plan.heads.map((h) => ({ head: h, required: Math.max(7, ((0.2 * 120) / h.kFactor) ** 2) }));
      const a = calculateArea(r.network, source, flowing, settings, 250);
      const model = buildModel(r.network, source, flowing, settings);
      const e = await solveWithEpanet(model, a.sourcePressure);
      expect(e.sourceFlow).toBeGreaterThan(0);
      expect(Math.abs(e.sourceFlow - a.sourceFlow) / a.sourceFlow).toBeLessThan(0.01);
      const reservoir = model.nodes[model.source]!.id; // a reservoir in EPANET, which reports no pressure there
      for (const n of a.nodes.filter((x) => x.id !== reservoir)) {
        expect(Math.abs(e.pressure.get(n.id)! - n.pressure) / a.sourcePressure).toBeLessThan(0.01);
      }
      // the most demanding head is exactly at its requirement, every other one above it
      const req = ((0.2 * 120) / 5.6) ** 2;
      const headPressures = a.nodes.filter((n) => n.flow > 0).map((n) => n.pressure);
      expect(Math.min(...headPressures)).toBeCloseTo(req, 5);
    });
  }
});

describe('one solver for many design areas, against EPANET', () => {
  // The solver keeps one model with every head, opens an area's heads and works on the network reduced to
  // junctions and open heads (pipes in series added up). EPANET gets each area as a network of its own.
  // Tolerance 1%: EPANET's Hazen-Williams exponent is 1.852, NFPA 13's 1.85 (EPANET 2.2 manual, from memory).
  const config = { defaults: { headElevation: 12, sourceElevation: 0 } };
  const settings = parseSettings(config);
  for (const gridded of [false, true]) {
    it(`${gridded ? 'grid' : 'tree'}: five areas of random heads, every node pressure and the source flow within 1%`, async () => {
      const r = checkLayout({ s: 12, l: 10, heads: 7, lines: 5, gridded }, config);
      const all = r.plan.heads.map((h) => ({ head: h, required: 7 }));
      const source = r.network.systems[0]!.sourceNodeId;
      const model = buildModel(r.network, source, all, settings);
      const solver = new NetworkSolver(model);
      let seed = 7;
      const random = () => {
        seed = (seed * 16807) % 2147483647;
        return seed / 2147483647;
      };
      for (let area = 0; area < 5; area++) {
        const open = all.filter(() => random() < 0.3);
        const ids = new Set(open.map((f) => f.head.id));
        const P = 40 + 40 * random();
        const state = solver.expand(solver.solve(P, Int32Array.from(model.emitters.flatMap((e, k) => (ids.has(e.headId) ? [k] : [])))));
        const e = await solveWithEpanet(buildModel(r.network, source, open, settings), P);
        const ours = new Map(model.nodes.map((n, i) => [n.id, state.pressure[i]!]));
        expect(e.pressure.size).toBeGreaterThan(10);
        for (const [id, p] of e.pressure) if (id !== 'SUPPLY') expect(Math.abs(ours.get(id)! - p) / P).toBeLessThan(0.01);
        const flow = state.emitterFlow.reduce((a, b) => a + b, 0);
        expect(Math.abs(e.sourceFlow - flow) / flow).toBeLessThan(0.01);
      }
    });
    // The solver reuses its buffers from solve to solve; a solve kept for its tables must not change when others
    // follow (a search expands its two areas after thousands of trial solves). Bit for bit: common practice, no source.
    it(`${gridded ? 'grid' : 'tree'}: a kept solve expands to the same state after solves of other areas`, () => {
      const r = checkLayout({ s: 12, l: 10, heads: 7, lines: 5, gridded }, config);
      const all = r.plan.heads.map((h) => ({ head: h, required: 7 }));
      const model = buildModel(r.network, r.network.systems[0]!.sourceNodeId, all, settings);
      const solver = new NetworkSolver(model);
      const openOf = (every: number, from: number) => Int32Array.from(model.emitters.flatMap((_, k) => (k % every === from ? [k] : [])));
      // Kept: the first three heads, so most of the system idles (dead ends peeled, chains carrying nothing); then
      // others, the last the last three heads (other dead ends).
      const n = model.emitters.length;
      const kept = solver.solve(50, Int32Array.of(0, 1, 2));
      const before = solver.expand(kept);
      solver.solve(60, openOf(3, 1), false);
      solver.solve(60, openOf(1, 0));
      solver.solve(60, Int32Array.of(n - 3, n - 2, n - 1), false);
      const after = solver.expand(kept);
      expect(before.pressure.some((p) => p > 0)).toBe(true);
      expect(Array.from(after.pressure)).toEqual(Array.from(before.pressure));
      expect(Array.from(after.flow)).toEqual(Array.from(before.flow));
      expect(Array.from(after.emitterFlow)).toEqual(Array.from(before.emitterFlow));
    });
  }
});

describe("an area's source pressure", () => {
  // The least source pressure at which every open head gets its requirement: satisfied there, short of it 0.001 psi
  // lower (the search's tolerance is 1e-6 psi; common practice, no source). Found cold (from the static head), and
  // warm from a neighbour that needed more or less, with the heads 40 ft above the source (17.3 psi of lift).
  for (const gridded of [false, true]) {
    it(`${gridded ? 'grid' : 'tree'}: the least that satisfies each area, cold and warm from either side`, () => {
      const config = { defaults: { headElevation: 40, sourceElevation: 0 } };
      const r = checkLayout({ s: 12, l: 10, heads: 7, lines: 5, gridded }, config);
      const flowing = r.plan.heads.map((h) => ({ head: h, required: 7 + (h.position.x % 3) }));
      const calculator = new AreaCalculator(r.network, r.network.systems[0]!.sourceNodeId, flowing, parseSettings(config));
      const ids = flowing.map((f) => f.head.id);
      // Areas of 6, 12, 4 and 9 heads in turn: each next one needs more, less and more than the one before, so the
      // search for it starts below, above and below its answer.
      const areas = [ids.slice(0, 6), ids.slice(0, 12), ids.slice(20, 24), ids.slice(10, 19)];
      const pressures = areas.map((area) => {
        const d = calculator.demand(area);
        expect(calculator.satisfiedAt(area, d.sourcePressure + 1e-6).satisfied).toBe(true);
        expect(calculator.satisfiedAt(area, d.sourcePressure - 1e-3).satisfied).toBe(false);
        return d.sourcePressure;
      });
      expect(pressures[1]).toBeGreaterThan(pressures[0]!);
      expect(pressures[2]).toBeLessThan(pressures[1]!);
      expect(pressures[3]).toBeGreaterThan(pressures[2]!);
      expect(Math.min(...pressures)).toBeGreaterThan(40 * 0.433); // above the lift (0.433 psi/ft, common practice)
    });
  }
});
