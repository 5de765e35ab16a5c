// The hydraulic calculation of design areas: the source pressure at which every flowing head gets its
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
const PRESSURE_TOL = 1e-6;
const MAX_SOLVES = 80;
/** Pipes carrying less than this share of the source flow are left out of an area's pipe table. */
const IDLE_SHARE = 1e-9;

/** Velocity in ft/s of `q` gpm in a pipe of inside diameter `d` inches: 0.4085·q/d² (derived from 1 gpm = 0.002228 ft³/s). */
export const velocityFtPerS = (q: number, d: number): number => (0.4085 * Math.abs(q)) / (d * d);

interface Trial { P: number; value: number; critical: number; state: FlowState }

/**
 * Calculates design areas on one network: built once with every head that may flow, then each area opens its
 * own heads and is solved warm from the previous one (neighbouring areas differ by a few heads).
 */
export class AreaCalculator {
  readonly model: HydraulicModel;
  private readonly solver: NetworkSolver;
  private readonly emitterOf: Map<string, number>;
  private readonly emitterAtNode: Map<number, number>;
  private readonly hand: ReturnType<typeof kFactorWalk>;
  private warm: FlowState | undefined;
  private lastPressure: number | undefined;

  constructor(network: Network, mayFlow: FlowingHead[], private readonly settings: Settings) {
    this.model = buildModel(network, mayFlow, settings);
    if (this.model.emitters.length === 0) throw new Error('no flowing head is connected to the source');
    this.solver = new NetworkSolver(this.model);
    this.emitterOf = new Map(this.model.emitters.map((e, k) => [e.headId, k]));
    this.emitterAtNode = new Map(this.model.emitters.map((e, k) => [e.node, k]));
    this.hand = kFactorWalk(this.model, HAND_METHOD_EXPONENT);
  }

  private openMask(headIds: string[]): Uint8Array {
    const open = new Uint8Array(this.model.emitters.length);
    for (const id of headIds) {
      const k = this.emitterOf.get(id);
      if (k === undefined) throw new Error(`head ${id} is not on the piping`);
      open[k] = 1;
    }
    return open;
  }

  /** One solve at source pressure P: the source flow, and whether every open head gets its required pressure. */
  satisfiedAt(headIds: string[], P: number): { satisfied: boolean; flow: number } {
    const open = this.openMask(headIds);
    this.warm = this.solver.solve(P, this.warm, open);
    let flow = 0;
    let satisfied = true;
    this.model.emitters.forEach((e, k) => {
      if (!open[k]) return;
      flow += this.warm!.emitterFlow[k]!;
      if (this.warm!.pressure[e.node]! < e.required - PRESSURE_TOL) satisfied = false;
    });
    return { satisfied, flow };
  }

  calculate(headIds: string[], hoseAllowance: number): AreaHydraulics {
    const { model, settings } = this;
    const open = this.openMask(headIds);
    const active = model.emitters.map((e, k) => ({ e, k })).filter(({ k }) => open[k]);
    let solves = 0;
    let iterations = 0;
    /** Slack of the most demanding open head at source pressure P (≥ 0: every head is satisfied). */
    const slack = (P: number): Trial => {
      this.warm = this.solver.solve(P, this.warm, open);
      solves++;
      iterations += this.warm.iterations;
      let value = Infinity;
      let critical = active[0]!.k;
      for (const { e, k } of active) {
        const v = this.warm.pressure[e.node]! - e.required;
        if (v < value) { value = v; critical = k; }
      }
      return { P, value, critical, state: this.warm };
    };
    const zSource = model.nodes[model.source]!.elevation;
    const staticHead = Math.max(...active.map(({ e }) => e.required + PSI_PER_FT * (model.nodes[e.node]!.elevation - zSource)));
    const found = findPressure(slack, staticHead, this.lastPressure, () => solves);
    this.lastPressure = found.P;
    const s = found.state;
    const P = found.P;
    const sourceFlow = active.reduce((sum, { k }) => sum + s.emitterFlow[k]!, 0);
    const totalDemand = sourceFlow + hoseAllowance;
    const supplyAvailable = settings.supply ? availablePressure(settings.supply, totalDemand) : null;
    const busy = model.pipes.map((_, k) => Math.abs(s.flow[k]!) > IDLE_SHARE * sourceFlow);
    const onBusy = new Set<number>([model.source]);
    model.pipes.forEach((p, k) => { if (busy[k]) { onBusy.add(p.from); onBusy.add(p.to); } });
    const hand = this.hand?.bound(headIds) ?? null;
    return {
      sourcePressure: P, sourceFlow, hoseAllowance, totalDemand, supplyAvailable,
      margin: supplyAvailable === null ? null : supplyAvailable - P,
      criticalHeadId: model.emitters[found.critical]!.headId,
      nodes: model.nodes.flatMap((n, i) => {
        if (!onBusy.has(i)) return [];
        const k = this.emitterAtNode.get(i);
        return [{ id: n.id, pressure: s.pressure[i]!, flow: k !== undefined && open[k] ? s.emitterFlow[k]! : 0, elevation: n.elevation }];
      }),
      pipes: model.pipes.flatMap((p, k) => busy[k] ? [{
        id: p.id, flow: s.flow[k]!, velocity: velocityFtPerS(s.flow[k]!, p.diameter), frictionLoss: p.r * Math.abs(s.flow[k]!) ** HW_EXPONENT,
        length: p.length, fittingsLength: p.fittingsLength, fittings: p.fittings,
      }] : []),
      riser: model.riser, handMethod: hand && { sourcePressure: hand.pressure, sourceFlow: hand.flow }, solves, iterations,
    };
  }
}

/**
 * The least source pressure at which the slack is ≥ 0 (to PRESSURE_TOL): a bracket from the static head, or
 * from the previous area's pressure when given (neighbouring areas need nearly the same), then Illinois.
 */
function findPressure(slack: (P: number) => Trial, staticHead: number, previous: number | undefined, solves: () => number): Trial {
  let lo: Trial;
  let hi: Trial;
  const first = slack(Math.max(staticHead, previous ?? staticHead));
  if (first.value >= -PRESSURE_TOL && first.P === staticHead) return first;
  if (first.value >= 0) {
    hi = first;
    lo = slack(staticHead);
    if (lo.value >= -PRESSURE_TOL) return lo;
  } else {
    lo = first;
    let step = Math.max(1, -2 * first.value);
    hi = slack(lo.P + step);
    while (hi.value < 0 && solves() < MAX_SOLVES) {
      lo = hi;
      step *= 2;
      hi = slack(lo.P + step);
    }
  }
  let fl = lo.value;
  let fh = hi.value;
  let side = 0;
  let last = hi;
  while (solves() < MAX_SOLVES && hi.P - lo.P > PRESSURE_TOL) {
    const m = slack(hi.P - (fh * (hi.P - lo.P)) / (fh - fl));
    last = m;
    if (Math.abs(m.value) <= PRESSURE_TOL) return m;
    if (m.value < 0) { lo = m; fl = m.value; if (side === -1) fh /= 2; side = -1; }
    else { hi = m; fh = m.value; if (side === 1) fl /= 2; side = 1; }
  }
  if (hi.value < -PRESSURE_TOL) throw new Error('the required source pressure could not be found');
  // The solver state is shared: the tables must come from a solve at hi itself.
  return last === hi ? hi : slack(hi.P);
}

/** One design area on its own. */
export function calculateArea(network: Network, flowing: FlowingHead[], settings: Settings, hoseAllowance: number): AreaHydraulics {
  return new AreaCalculator(network, flowing, settings).calculate(flowing.map((f) => f.head.id), hoseAllowance);
}
