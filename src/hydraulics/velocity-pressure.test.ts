// Normal pressure at flowing outlets against a sequential hand calculation written out here (the trial the
// standard's annex describes: the flow in the pipe feeding an outlet includes the outlet's own), and end to end.

import { describe, expect, it } from 'vitest';
import { checkLayout } from '../../test/support/check.js';
import { frictionPsiPerFt, resistance } from './hazen-williams.js';
import { pipesAtNodes, type HydraulicModel, type ModelPipe } from './model.js';
import { NetworkSolver } from './solver.js';
import { normalPressureDrops, solveAtNormalPressure, velocityPressurePsi } from './velocity-pressure.js';

/** 1 in and 2 in Schedule 40 inside diameters, in (common practice, no source: the steel pipe tables). */
const D1 = 1.049;
const D2 = 2.067;
const K = 5.6;
const REQUIRED = 7; // psi at the end head (NFPA 13 (2016 edition), 23.4.4.9.1: 7 psi least operating pressure, from memory)

describe('velocity pressure', () => {
  it('Pv = 0.001123·Q²/d⁴ psi is v²/2g at 0.433 psi/ft with v = 0.4085·Q/d² ft/s (g = 32.174 ft/s², from memory)', () => {
    const q = 100;
    const v = (0.4085 * q) / D2 ** 2; // ft/s: 1 gpm = 0.002228 ft³/s over π·d²/4/144 ft²
    const feet = (v * v) / (2 * 32.174);
    expect(Math.abs(velocityPressurePsi(q, D2) / (feet * 0.4331) - 1)).toBeLessThan(1e-3);
    // 100 gpm in 2 in Schedule 40: 0.001123 × 10⁴ / 2.067⁴ = 11.23 / 18.254 = 0.6152 psi (evaluated by hand)
    expect(velocityPressurePsi(q, D2)).toBeCloseTo(0.6152, 4);
  });
});

/**
 * S —10 ft 2 in— T1 —40 ft 2 in— T2: a cross main (run 0) ending in T2. Each tee feeds a branch line of three
 * heads 12 ft apart on 1 in pipe, heads in the line (runs 1 and 2); the first line leaves T1 from the side while
 * the cross main runs on, the second takes the cross main's end.
 */
function twoLines(): HydraulicModel {
  const nodes = ['S', 'T1', 'T2', 'A1', 'A2', 'A3', 'B1', 'B2', 'B3'].map((id) => ({ id, elevation: 0 }));
  const at = (id: string) => nodes.findIndex((n) => n.id === id);
  const pipe = (id: string, from: string, to: string, length: number, diameter: number, run: number): ModelPipe => ({
    id,
    from: at(from),
    to: at(to),
    length,
    fittingsLength: 0,
    fittings: [],
    nominalSize: diameter === D1 ? '1' : '2',
    diameter,
    c: 120,
    r: resistance(length, 120, diameter),
    run,
  });
  return {
    nodes,
    pipes: [
      pipe('M1', 'S', 'T1', 10, D2, 0),
      pipe('M2', 'T1', 'T2', 40, D2, 0),
      pipe('a1', 'T1', 'A1', 12, D1, 1),
      pipe('a2', 'A1', 'A2', 12, D1, 1),
      pipe('a3', 'A2', 'A3', 12, D1, 1),
      pipe('b1', 'T2', 'B1', 12, D1, 2),
      pipe('b2', 'B1', 'B2', 12, D1, 2),
      pipe('b3', 'B2', 'B3', 12, D1, 2),
    ],
    emitters: ['A1', 'A2', 'A3', 'B1', 'B2', 'B3'].map((id) => ({ node: at(id), headId: id, k: K, required: REQUIRED })),
    source: 0,
    riser: { modelled: 'none', length: 0, nominalSize: '2' },
  };
}

/** Hazen-Williams loss over a length, the NFPA 13 form (4.52·Q^1.85 / (C^1.85·d^4.87) psi/ft). */
const hw = (q: number, length: number, d: number) => length * frictionPsiPerFt(q, 120, d);

/**
 * A branch line by hand from its end head at pressure pEnd, against the flow: the end head at its total pressure
 * (no water runs past it), each head before it at its normal pressure, Pn = Pt − Pv of the pipe feeding it, whose
 * flow holds the head's own: found by repeated trial. Returns the pressure and the flow at the tee.
 */
function lineByHand(pEnd: number): { pTee: number; flow: number; heads: number[] } {
  const heads = [K * Math.sqrt(pEnd)];
  let flow = heads[0]!;
  let p = pEnd;
  for (let h = 0; h < 2; h++) {
    p += hw(flow, 12, D1);
    let q = K * Math.sqrt(p);
    for (let trial = 0; trial < 100; trial++) q = K * Math.sqrt(p - velocityPressurePsi(flow + q, D1));
    heads.unshift(q);
    flow += q;
  }
  return { pTee: p + hw(flow, 12, D1), flow, heads };
}

/** The end-head pressure at which a line's tee needs `pTee` (bisection). */
function lineForTee(pTee: (flow: number) => number): ReturnType<typeof lineByHand> {
  let lo = 0;
  let hi = 100;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    const line = lineByHand(mid);
    if (line.pTee > pTee(line.flow)) hi = mid;
    else lo = mid;
  }
  return lineByHand(lo);
}

describe('normal pressure on branch lines and cross mains', () => {
  // By hand: the far line (B) from its end head at 7 psi; up the cross main to T1; the near line (A) leaves T1 from
  // the side, so it gets T1's total pressure less the velocity pressure of M1, which carries both lines' water.
  const B = lineByHand(REQUIRED);
  const pT2 = B.pTee;
  const pT1 = pT2 + hw(B.flow, 40, D2);
  const A = lineForTee((flowA) => pT1 - velocityPressurePsi(flowA + B.flow, D2));
  const pS = pT1 + hw(A.flow + B.flow, 10, D2);

  it('the hand calculation: the near line gets more than the far one needs, so the far end head controls', () => {
    expect(A.heads.at(-1)! / K).toBeGreaterThan(Math.sqrt(REQUIRED));
    // the deduction at T1 is real: M1 carries about 100 gpm, about 0.6 psi of velocity pressure in 2 in pipe
    expect(velocityPressurePsi(A.flow + B.flow, D2)).toBeGreaterThan(0.5);
  });

  it('the solver, at the source pressure found by hand, gives every head the hand flow (1e-6 relative)', () => {
    const model = twoLines();
    const solver = new NetworkSolver(model);
    const { state, solves } = solveAtNormalPressure(solver, pipesAtNodes(model), pS);
    expect(solves).toBeGreaterThan(1);
    // emitters in the model's order: A1 A2 A3 B1 B2 B3, as the hand calculation lists them
    const byHand = [...A.heads, ...B.heads];
    state.open.forEach((k, x) => {
      expect(state.flow[x]).toBeCloseTo(byHand[k]!, 5);
    });
    // the end head of the far line flows at exactly its required pressure (its total pressure: nothing runs past)
    const endHead = Array.from(state.open).indexOf(5);
    expect(state.pressure[endHead]).toBeCloseTo(REQUIRED, 6);
  });

  it('where each deduction falls: heads the water runs past, the side outlet at T1; not the end heads, not the cross main end', () => {
    const model = twoLines();
    const solver = new NetworkSolver(model);
    const { state } = solveAtNormalPressure(solver, pipesAtNodes(model), pS);
    const s = solver.expand(state);
    const drops = normalPressureDrops(model, pipesAtNodes(model), s);
    // heads A1, A2, B1, B2 deduct the velocity pressure of the 1 in pipe feeding them; A3 and B3 nothing
    expect(drops.emitter[0]).toBeCloseTo(velocityPressurePsi(A.flow, D1), 6);
    expect(drops.emitter[1]).toBeCloseTo(velocityPressurePsi(A.heads[1]! + A.heads[2]!, D1), 6);
    expect(drops.emitter[2]).toBe(0);
    expect(drops.emitter[3]).toBeCloseTo(velocityPressurePsi(B.flow, D1), 6);
    expect(drops.emitter[5]).toBe(0);
    // pipe a1 leaves T1 from the side of the running cross main: M1's velocity pressure; b1 takes the main's end: none
    expect(drops.pipe[2]).toBeCloseTo(velocityPressurePsi(A.flow + B.flow, D2), 6);
    expect(drops.pipe[5]).toBe(0);
    expect(drops.pipe[0]).toBe(0);
    // the total pressure at A1's node is T1's less the deduction and a1's friction
    expect(s.pressure[3]).toBeCloseTo(pT1 - drops.pipe[2]! - hw(A.flow, 12, D1), 6);
  });

  it('at the total pressure the same system needs more at the source (the deductions lower the flows)', () => {
    const model = twoLines();
    const solver = new NetworkSolver(model);
    const total = solver.solve(pS);
    // at the same source pressure, heads flowing at the total pressure flow more
    const sum = (xs: Float64Array) => xs.reduce((a, b) => a + b, 0);
    expect(sum(total.flow)).toBeGreaterThan(A.flow + B.flow);
  });
});

describe('the check with velocityPressure', () => {
  const layout = { s: 12, l: 10, heads: 6, lines: 5 };
  const normal = checkLayout(layout, { design: { areaMode: 'search', velocityPressure: true } });
  const total = checkLayout(layout, { design: { areaMode: 'search' } });
  const best = (r: typeof normal) => r.report.designAreas.find((a) => a.rank === 'most-demanding')!.hydraulics!;

  it('states the basis, and every head flows at K·√(total − velocity pressure), the controlling one at exactly its need', () => {
    const n = best(normal);
    expect(n.pressureBasis.basis).toBe('normal');
    expect(best(total).pressureBasis.basis).toBe('total');
    // Here the heads flow less in all (each deducts), but the source needs more: the controlling line leaves the
    // cross main from the side where the main runs on, and pays the main's velocity pressure at its tee.
    expect(n.sourceFlow).toBeLessThan(best(total).sourceFlow);
    const controlling = n.heads.find((h) => h.handle === n.controllingHead)!;
    expect(controlling.normalPressure).toBeCloseTo(controlling.requiredPressure, 3);
    expect(n.heads.some((h) => h.velocityPressure > 0)).toBe(true);
    for (const h of n.heads) {
      expect(h.normalPressure).toBeCloseTo(h.pressure - h.velocityPressure, 3);
      expect(h.flow).toBeCloseTo(h.kFactor * Math.sqrt(h.normalPressure), 2);
      expect(h.normalPressure).toBeGreaterThanOrEqual(h.requiredPressure - 1e-3);
    }
  });

  it('each step adds up: pressure at to = at from + friction + rise + side-outlet deduction', () => {
    const n = best(normal);
    for (const s of n.steps) expect(s.pressureTo).toBeCloseTo(s.pressureFrom + s.friction + s.elevationChange + s.sideOutletDeduction, 3);
    expect(n.steps.some((s) => s.sideOutletDeduction > 0)).toBe(true);
  });

  it('the search ranks at the total pressure, where its proof holds, and the two areas it finds are calculated at the normal pressure', () => {
    expect(normal.report.design.search).toEqual(total.report.design.search);
    expect(normal.report.design.search?.evaluated).toBeLessThan(normal.report.design.search!.candidates);
    const areas = (r: typeof normal) => r.report.designAreas.filter((a) => a.rank !== null);
    expect(areas(normal).map((a) => [...a.heads].sort())).toEqual(
      areas(total)
        .map((a) => [...a.heads].sort())
        .slice(0, 2),
    );
    // ranked again at the normal pressure: the most demanding needs at least what the runner-up needs
    const [best, runnerUp] = areas(normal).map((a) => a.hydraulics!);
    expect(best!.sourcePressure).toBeGreaterThanOrEqual(runnerUp!.sourcePressure - 1e-9);
    expect(normal.report.findings.some((f) => f.message.includes('velocity pressure'))).toBe(false);
  });
});
