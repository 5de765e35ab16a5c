// The hydraulic calculation of design areas: the source pressure at which every flowing head gets its
// required pressure (the most demanding one exactly), the resulting flows, and the water supply margin.

import type { Settings } from '../config/settings.js';
import type { Network } from '../network/types.js';
import { frictionPsiPerFt, HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import { HAND_METHOD_EXPONENT, kFactorWalk } from './k-factor-walk.js';
import { buildModel, pipesAtNodes, type FlowingHead, type HydraulicModel, type PipesAtNodes } from './model.js';
import { NetworkSolver, type FlowState, type SolveResult } from './solver.js';
import { type PathStep, supplyOf } from './supply-path.js';
import { solveAtNormalPressure, type NormalPressureDrops, type PressureBasis } from './velocity-pressure.js';
import { maxOf } from '../arrays.js';

export interface AreaHydraulics {
  sourcePressure: number;
  sourceFlow: number;
  hoseAllowance: number;
  totalDemand: number;
  supplyAvailable: number | null;
  margin: number | null;
  /** The supply path at the total demand, from the flow-test point to the source (empty without a path). */
  supplyPath: PathStep[];
  criticalHeadId: string;
  /** Handle of the head that sets the pressure: it gets exactly its required pressure. */
  controllingHead: string;
  /** The calculation a reader follows, one pipe a step from the controlling head up to the source. */
  steps: CalculationStep[];
  /** Every flowing head of the area. */
  heads: FlowingHeadResult[];
  nodes: { id: string; pressure: number; flow: number; elevation: number }[];
  pipes: {
    id: string;
    from: string;
    to: string;
    nominalSize: string;
    innerDiameter: number;
    cFactor: number;
    flow: number;
    velocity: number;
    frictionPerLength: number;
    frictionLoss: number;
    /** Plan length plus fittings, ft, and the fittings' share. */
    length: number;
    fittingsLength: number;
    fittings: string[];
  }[];
  riser: HydraulicModel['riser'];
  /** Which pressure the heads flow at: total, or normal (total less velocity pressure where water runs past). */
  pressureBasis: PressureBasis;
  /** The classic hand method (K-factor balancing at junctions) on tree systems, for comparison; null otherwise. */
  handMethod: { sourcePressure: number; sourceFlow: number } | null;
  solves: number;
  iterations: number;
}

/**
 * One pipe of the way from the controlling head to the source, against the flow: the pressure at its upstream end
 * (`to`) is the pressure at `from` plus its friction and the pressure the rise from `to` up to `from` costs.
 */
export interface CalculationStep {
  pipe: string;
  from: string;
  to: string;
  nominalSize: string;
  innerDiameter: number;
  /** Plan length and the equivalent length of its fittings, ft. */
  length: number;
  fittingsLength: number;
  fittings: string[];
  cFactor: number;
  flow: number;
  /** Hazen-Williams friction, psi/ft, and over length + fittings, psi. */
  frictionPerLength: number;
  friction: number;
  /** 0.433 psi/ft × (elevation of `from` − elevation of `to`), psi. */
  elevationChange: number;
  /** With normal pressure: the velocity pressure deducted where this pipe leaves its tee (`to`) from the side, psi; else 0. */
  sideOutletDeduction: number;
  pressureFrom: number;
  pressureTo: number;
  velocity: number;
}

export interface FlowingHeadResult {
  handle: string;
  node: string;
  kFactor: number;
  requiredPressure: number;
  /** Total pressure at the head's node. */
  pressure: number;
  /** The velocity pressure deducted (0 at the total pressure) and what the head flows at: flow = K·√(pressure − it). */
  velocityPressure: number;
  normalPressure: number;
  flow: number;
}

/** The source pressure is found to within this many psi (stated tolerance). */
const PRESSURE_TOL = 1e-6;
const MAX_SOLVES = 80;
/** Pipes carrying less than this share of the source flow are left out of an area's pipe table. */
const IDLE_SHARE = 1e-9;

/** Velocity in ft/s of `q` gpm in a pipe of inside diameter `d` inches: 0.4085·q/d² (derived from 1 gpm = 0.002228 ft³/s). */
const velocityFtPerS = (q: number, d: number): number => (0.4085 * Math.abs(q)) / (d * d);

interface Trial {
  P: number;
  value: number;
  critical: number;
  /** The critical head's pressure, and how far it sits above the source in psi of water column. */
  pressure: number;
  lift: number;
  state: SolveResult;
}

/** What a design area needs at the source, before its tables are drawn up. */
export interface AreaDemand {
  headIds: string[];
  sourcePressure: number;
  sourceFlow: number;
  criticalHeadId: string;
  solves: number;
  iterations: number;
  /** The solve at the source pressure found, and the normal-pressure deductions it was made with (null: none). */
  readonly state: SolveResult;
  readonly drops: NormalPressureDrops | null;
}

/**
 * Calculates design areas on one network: built once with every head that may flow, then each area opens its
 * own heads and is solved warm from the previous one (neighbouring areas differ by a few heads).
 */
export class AreaCalculator {
  readonly model: HydraulicModel;
  readonly solver: NetworkSolver;
  private readonly emitterOf: Map<string, number>;
  private readonly handleOf: Map<string, string>;
  private readonly hand: ReturnType<typeof kFactorWalk>;
  private lastPressure: number | undefined;
  /** The pipes at each model node, when heads flow at the normal pressure (null: total pressure). */
  private readonly pipesAt: PipesAtNodes | null;

  constructor(
    network: Network,
    sourceNodeId: string,
    mayFlow: FlowingHead[],
    private readonly settings: Settings,
  ) {
    this.model = buildModel(network, sourceNodeId, mayFlow, settings);
    if (this.model.emitters.length === 0) throw new Error('no flowing head is connected to the source');
    this.solver = new NetworkSolver(this.model);
    this.emitterOf = new Map(this.model.emitters.map((e, k) => [e.headId, k]));
    this.handleOf = new Map(mayFlow.map((f) => [f.head.id, f.head.handle]));
    this.pipesAt = settings.design.velocityPressure ? pipesAtNodes(this.model) : null;
    // The hand method balances total pressures: no comparison when heads flow at the normal pressure.
    this.hand = this.pipesAt ? null : kFactorWalk(this.model, HAND_METHOD_EXPONENT, this.solver.skeleton);
  }

  /** A solve at source pressure P, at the heads' pressure basis (the normal pressure takes a few solves). */
  private solveAt(P: number, open: Int32Array, keep: boolean): { state: SolveResult; solves: number; iterations: number } {
    if (this.pipesAt) return solveAtNormalPressure(this.solver, this.pipesAt, P, open);
    const state = this.solver.solve(P, open, keep);
    return { state, solves: 1, iterations: state.iterations };
  }

  private openList(headIds: string[]): Int32Array {
    return Int32Array.from(new Set(headIds), (id) => {
      const k = this.emitterOf.get(id);
      if (k === undefined) throw new Error(`head ${id} is not connected to the water source through the piping`);
      return k;
    });
  }

  /** One solve at source pressure P: the source flow, and whether every open head gets its required pressure. */
  satisfiedAt(headIds: string[], P: number): { satisfied: boolean; flow: number } {
    const s = this.solveAt(P, this.openList(headIds), false).state;
    let flow = 0;
    let satisfied = true;
    s.open.forEach((k, x) => {
      flow += s.flow[x]!;
      if (s.pressure[x]! < this.model.emitters[k]!.required - PRESSURE_TOL) satisfied = false;
    });
    return { satisfied, flow };
  }

  /** The least source pressure at which every head of the area gets its required pressure, and the flow then. */
  demand(headIds: string[]): AreaDemand {
    const { model } = this;
    const open = this.openList(headIds);
    let solves = 0;
    let trials = 0;
    let iterations = 0;
    const zSource = model.nodes[model.source]!.elevation;
    /** How far emitter k sits above the source, in psi of water column. */
    const liftOf = (k: number) => PSI_PER_FT * (model.nodes[model.emitters[k]!.node]!.elevation - zSource);
    /** Slack of the most demanding open head at source pressure P (≥ 0: every head is satisfied). */
    const slack = (P: number): Trial => {
      const at = this.solveAt(P, open, true);
      const state = at.state;
      trials++;
      solves += at.solves;
      iterations += at.iterations;
      let value = Infinity;
      let critical = state.open[0]!;
      state.open.forEach((k, x) => {
        const v = state.pressure[x]! - model.emitters[k]!.required;
        if (v < value) {
          value = v;
          critical = k;
        }
      });
      return { P, value, critical, pressure: value + model.emitters[critical]!.required, lift: liftOf(critical), state };
    };
    const staticHead = maxOf(Array.from(open, (k) => model.emitters[k]!.required + liftOf(k)));
    const found = findPressure(slack, staticHead, this.lastPressure, () => trials);
    this.lastPressure = found.P;
    return {
      headIds,
      sourcePressure: found.P,
      sourceFlow: found.state.flow.reduce((sum, q) => sum + q, 0),
      criticalHeadId: model.emitters[found.critical]!.headId,
      solves,
      iterations,
      state: found.state,
      drops: found.state.solution?.drops ?? null,
    };
  }

  /** The full calculation of a design area: demand, supply, and the node and pipe tables. */
  calculate(headIds: string[], hoseAllowance: number): AreaHydraulics {
    return this.hydraulicsOf(this.demand(headIds), hoseAllowance);
  }

  /** The tables and supply comparison of an area whose demand was found. */
  hydraulicsOf(d: AreaDemand, hoseAllowance: number): AreaHydraulics {
    const { model, settings } = this;
    const s = this.solver.expand(d.state);
    const drops = d.drops;
    const { sourcePressure: P, sourceFlow } = d;
    const totalDemand = sourceFlow + hoseAllowance;
    const supply = supplyOf(settings);
    const supplyAvailable = supply ? supply.available(totalDemand) : null;
    const hand = this.hand?.bound(d.headIds) ?? null;
    return {
      sourcePressure: P,
      sourceFlow,
      hoseAllowance,
      totalDemand,
      supplyAvailable,
      margin: supplyAvailable === null ? null : supplyAvailable - P,
      criticalHeadId: d.criticalHeadId,
      controllingHead: this.handleOf.get(d.criticalHeadId)!,
      steps: stepsToSource(model, s, drops, this.emitterOf.get(d.criticalHeadId)!),
      supplyPath: supply?.hasPath ? supply.steps(totalDemand) : [],
      heads: d.state.open.length
        ? Array.from(d.state.open, (k) => {
            const e = model.emitters[k]!;
            const velocityPressure = drops?.emitter[k] ?? 0;
            return {
              handle: this.handleOf.get(e.headId)!,
              node: model.nodes[e.node]!.id,
              kFactor: e.k,
              requiredPressure: e.required,
              pressure: s.pressure[e.node]!,
              velocityPressure,
              normalPressure: s.pressure[e.node]! - velocityPressure,
              flow: s.emitterFlow[k]!,
            };
          })
        : [],
      ...busyTables(model, s, sourceFlow),
      riser: model.riser,
      pressureBasis: this.pipesAt ? 'normal' : 'total',
      handMethod: hand && { sourcePressure: hand.pressure, sourceFlow: hand.flow },
      solves: d.solves,
      iterations: d.iterations,
    };
  }
}

/** The nodes and pipes that carry the area's water (more than a trace of it), as the report tables them. */
function busyTables(model: HydraulicModel, s: FlowState, sourceFlow: number): Pick<AreaHydraulics, 'nodes' | 'pipes'> {
  // Flags and indexes by number: an area's tables are drawn from models of tens of thousands of nodes.
  const busy = Uint8Array.from(model.pipes, (_, k) => (Math.abs(s.flow[k]!) > IDLE_SHARE * sourceFlow ? 1 : 0));
  const onBusy = new Uint8Array(model.nodes.length);
  onBusy[model.source] = 1;
  model.pipes.forEach((p, k) => {
    if (busy[k]) onBusy[p.from] = onBusy[p.to] = 1;
  });
  const emitterAtNode = new Int32Array(model.nodes.length).fill(-1);
  model.emitters.forEach((e, k) => {
    emitterAtNode[e.node] = k;
  });
  const nodes: AreaHydraulics['nodes'] = [];
  model.nodes.forEach((n, i) => {
    if (!onBusy[i]) return;
    const k = emitterAtNode[i]!;
    nodes.push({ id: n.id, pressure: s.pressure[i]!, flow: k >= 0 ? s.emitterFlow[k]! : 0, elevation: n.elevation });
  });
  const pipes: AreaHydraulics['pipes'] = [];
  model.pipes.forEach((p, k) => {
    if (!busy[k]) return;
    const flow = s.flow[k]!;
    pipes.push({
      id: p.id,
      from: model.nodes[p.from]!.id,
      to: model.nodes[p.to]!.id,
      nominalSize: p.nominalSize,
      innerDiameter: p.diameter,
      cFactor: p.c,
      flow,
      velocity: velocityFtPerS(flow, p.diameter),
      frictionPerLength: frictionPsiPerFt(flow, p.c, p.diameter),
      frictionLoss: p.r * Math.abs(flow) ** HW_EXPONENT,
      length: p.length,
      fittingsLength: p.fittingsLength,
      fittings: p.fittings,
    });
  });
  return { nodes, pipes };
}

/**
 * The way from emitter `k`'s node to the source against the flow: at each node the pipe bringing it the most
 * water (flow runs from higher to lower head, so the way never turns back), one step per pipe.
 */
function stepsToSource(model: HydraulicModel, s: FlowState, drops: NormalPressureDrops | null, k: number): CalculationStep[] {
  const incident = pipesAtNodes(model);
  const steps: CalculationStep[] = [];
  const seen = new Set<number>();
  for (let v = model.emitters[k]!.node; v !== model.source && !seen.has(v); ) {
    seen.add(v);
    // The flow into v along pipe i: its flow runs from → to, so into v where v is `to` and the flow is positive.
    const inflow = (i: number) => (model.pipes[i]!.to === v ? s.flow[i]! : -s.flow[i]!);
    const i = incident[v]!.reduce((a, b) => (inflow(b) > inflow(a) ? b : a));
    if (!(inflow(i) > 0)) break;
    const p = model.pipes[i]!;
    const u = p.to === v ? p.from : p.to;
    const flow = inflow(i);
    const perLength = frictionPsiPerFt(flow, p.c, p.diameter);
    steps.push({
      pipe: p.id,
      from: model.nodes[v]!.id,
      to: model.nodes[u]!.id,
      nominalSize: p.nominalSize,
      innerDiameter: p.diameter,
      length: p.length - p.fittingsLength,
      fittingsLength: p.fittingsLength,
      fittings: p.fittings,
      cFactor: p.c,
      flow,
      frictionPerLength: perLength,
      friction: p.r * flow ** HW_EXPONENT,
      elevationChange: PSI_PER_FT * (model.nodes[v]!.elevation - model.nodes[u]!.elevation),
      sideOutletDeduction: drops ? (p.from === u ? 1 : -1) * drops.pipe[i]! : 0,
      pressureFrom: s.pressure[v]!,
      pressureTo: s.pressure[u]!,
      velocity: velocityFtPerS(flow, p.diameter),
    });
    v = u;
  }
  return steps;
}

/**
 * The least source pressure at which the slack is ≥ 0 (to PRESSURE_TOL). From the static head, or from the previous
 * area's pressure when given (neighbouring areas need nearly the same), a bracket is sought by steps that the
 * critical head's pressure guesses (it grows about in proportion to the source's above its lift), then by secants
 * through the last two trials; once bracketed, Illinois.
 */
function findPressure(slack: (P: number) => Trial, staticHead: number, previous: number | undefined, solves: () => number): Trial {
  /** The highest trial short of the requirement and the lowest that meets it, once found. */
  const bracket: { low: Trial | null; high: Trial | null } = { low: null, high: null };
  const take = (t: Trial) => {
    if (t.value >= 0) bracket.high = bracket.high && bracket.high.P <= t.P ? bracket.high : t;
    else bracket.low = bracket.low && bracket.low.P >= t.P ? bracket.low : t;
  };
  let last = slack(Math.max(staticHead, previous ?? staticHead));
  if (Math.abs(last.value) <= PRESSURE_TOL || (last.value >= 0 && last.P === staticHead)) return last;
  take(last);
  let before: Trial | null = null;
  let step = Math.max(1, -2 * last.value);
  while (!(bracket.low && bracket.high) && solves() < MAX_SOLVES) {
    const scaled = last.pressure > 0 && last.P > last.lift ? last.P - (last.value * (last.P - last.lift)) / last.pressure : Number.NaN;
    let P = before ? last.P - (last.value * (last.P - before.P)) / (last.value - before.value) : scaled;
    if (bracket.high) P = Number.isFinite(P) && P < bracket.high.P ? Math.max(P, staticHead) : staticHead;
    else if (!(Number.isFinite(P) && P > bracket.low!.P)) {
      P = bracket.low!.P + step;
      step *= 2;
    } else P = Math.min(P, bracket.low!.P + Math.max(step, 16 * Math.abs(bracket.low!.P))); // a guess from a head near empty overshoots
    before = last;
    last = slack(P);
    if (Math.abs(last.value) <= PRESSURE_TOL || (last.value >= 0 && P === staticHead)) return last;
    take(last);
  }
  let low = bracket.low;
  let high = bracket.high;
  if (!low || !high) throw new Error('the required source pressure could not be found');
  let fl = low.value;
  let fh = high.value;
  let side = 0;
  while (solves() < MAX_SOLVES && high.P - low.P > PRESSURE_TOL) {
    const m = slack(high.P - (fh * (high.P - low.P)) / (fh - fl));
    if (Math.abs(m.value) <= PRESSURE_TOL) return m;
    if (m.value < 0) {
      low = m;
      fl = m.value;
      if (side === -1) fh /= 2;
      side = -1;
    } else {
      high = m;
      fh = m.value;
      if (side === 1) fl /= 2;
      side = 1;
    }
  }
  if (high.value < -PRESSURE_TOL) throw new Error('the required source pressure could not be found');
  return high;
}

/** One design area on its own, fed from node `sourceNodeId`. */
export function calculateArea(
  network: Network,
  sourceNodeId: string,
  flowing: FlowingHead[],
  settings: Settings,
  hoseAllowance: number,
): AreaHydraulics {
  return new AreaCalculator(network, sourceNodeId, flowing, settings).calculate(
    flowing.map((f) => f.head.id),
    hoseAllowance,
  );
}
