// The hydraulic calculation of one design area: the source pressure at which every flowing head gets its
// required pressure (the most demanding one exactly), the resulting flows, and the water supply margin.

import type { Settings } from '../config/settings.js';
import type { Network } from '../network/types.js';
import { HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import { HAND_METHOD_EXPONENT, kFactorWalk } from './k-factor-walk.js';
import { buildModel, type FlowingHead, type HydraulicModel } from './model.js';
import { NetworkSolver, type FlowState } from './solver.js';
import { availablePressure } from './water-supply.js';

export interface AreaHydraulics {
  sourcePressure: number;
  sourceFlow: number;
  hoseAllowance: number;
  totalDemand: number;
  supplyAvailable: number | null;
  margin: number | null;
  criticalHeadId: string;
  nodes: { id: string; pressure: number; flow: number; elevation: number }[];
  pipes: { id: string; flow: number; velocity: number; frictionLoss: number; length: number; fittingsLength: number; fittings: string[] }[];
  riser: HydraulicModel['riser'];
  /** The classic hand method (K-factor balancing at junctions) on tree systems, for comparison; null otherwise. */
  handMethod: { sourcePressure: number; sourceFlow: number } | null;
  solves: number;
  iterations: number;
}

/** The source pressure is found to within this many psi (stated tolerance). */
const PRESSURE_TOL = 1e-7;
const MAX_SOLVES = 80;

/** Velocity in ft/s of `q` gpm in a pipe of inside diameter `d` inches: 0.4085·q/d² (derived from 1 gpm = 0.002228 ft³/s). */
export const velocityFtPerS = (q: number, d: number): number => (0.4085 * Math.abs(q)) / (d * d);

export function calculateArea(network: Network, flowing: FlowingHead[], settings: Settings, hoseAllowance: number): AreaHydraulics {
  const model = buildModel(network, flowing, settings);
  if (model.emitters.length === 0) throw new Error('no flowing head is connected to the source');
  const solver = new NetworkSolver(model);
  let solves = 0;
  let iterations = 0;
  let state: FlowState | undefined;
  const zSource = model.nodes[model.source]!.elevation;
  /** Shortfall of the most demanding head at source pressure P (≥ 0 means every head is satisfied). */
  const slack = (P: number) => {
    state = solver.solve(P, state);
    solves++;
    iterations += state.iterations;
    let worst = Infinity;
    let critical = 0;
    model.emitters.forEach((e, k) => {
      const s = state!.pressure[e.node]! - e.required;
      if (s < worst) { worst = s; critical = k; }
    });
    return { value: worst, critical, state: state! };
  };
  // Static head alone is a lower bound of the source pressure; friction only adds to it.
  let lo = Math.max(...model.emitters.map((e) => e.required + PSI_PER_FT * (model.nodes[e.node]!.elevation - zSource)));
  let flo = slack(lo);
  let best = flo;
  let P = lo;
  if (flo.value < -PRESSURE_TOL) {
    let hi = lo + Math.max(1, -2 * flo.value);
    let fhi = slack(hi);
    while (fhi.value < 0 && solves < MAX_SOLVES) {
      const width = hi - lo;
      lo = hi; flo = fhi;
      hi = lo + 2 * width + 1;
      fhi = slack(hi);
    }
    // Illinois regula falsi on the bracket [lo, hi].
    let side = 0;
    let fl = flo.value;
    let fh = fhi.value;
    best = fhi;
    P = hi;
    while (solves < MAX_SOLVES && hi - lo > PRESSURE_TOL) {
      const m = hi - (fh * (hi - lo)) / (fh - fl);
      const fm = slack(m);
      if (Math.abs(fm.value) <= PRESSURE_TOL) { best = fm; P = m; break; }
      if (fm.value < 0) { lo = m; fl = fm.value; if (side === -1) fh /= 2; side = -1; }
      else { hi = m; fh = fm.value; best = fm; P = m; if (side === 1) fl /= 2; side = 1; }
    }
    if (best.value < -PRESSURE_TOL) throw new Error('the required source pressure could not be found');
  }
  const s = best.state;
  const sourceFlow = model.emitters.reduce((sum, _, k) => sum + s.emitterFlow[k]!, 0);
  const totalDemand = sourceFlow + hoseAllowance;
  const supplyAvailable = settings.supply ? availablePressure(settings.supply, totalDemand) : null;
  const emitterAt = new Map(model.emitters.map((e, k) => [e.node, k]));
  const hand = kFactorWalk(model, HAND_METHOD_EXPONENT)?.bound(model.emitters.map((e) => e.headId)) ?? null;
  return {
    sourcePressure: P, sourceFlow, hoseAllowance, totalDemand, supplyAvailable,
    margin: supplyAvailable === null ? null : supplyAvailable - P,
    criticalHeadId: model.emitters[best.critical]!.headId,
    nodes: model.nodes.map((n, i) => ({
      id: n.id, pressure: s.pressure[i]!, flow: emitterAt.has(i) ? s.emitterFlow[emitterAt.get(i)!]! : 0, elevation: n.elevation,
    })),
    pipes: model.pipes.map((p, k) => ({
      id: p.id, flow: s.flow[k]!, velocity: velocityFtPerS(s.flow[k]!, p.diameter), frictionLoss: p.r * Math.abs(s.flow[k]!) ** HW_EXPONENT,
      length: p.length, fittingsLength: p.fittingsLength, fittings: p.fittings,
    })),
    riser: model.riser, handMethod: hand && { sourcePressure: hand.pressure, sourceFlow: hand.flow }, solves, iterations,
  };
}
