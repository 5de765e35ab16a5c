// Steady flow in a sprinkler network by the global gradient method (Todini-Pilati; the method of EPANET):
// Newton iterations on pipe flows and node pressures together, heads as emitters q = K·√p, any topology.

import { HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import type { HydraulicModel } from './model.js';
import { SparseSpdSystem } from './sparse-cholesky.js';

export interface FlowState {
  /** Pressure at each model node, psi. */
  pressure: Float64Array;
  /** Flow in each pipe from `from` to `to`, gpm (negative: the other way). */
  flow: Float64Array;
  /** Flow out of each emitter, gpm. */
  emitterFlow: Float64Array;
  iterations: number;
}

/** Convergence: flow changes below 1e-9 of the total flow and head changes below 1e-8 psi (stated tolerances). */
const FLOW_TOL = 1e-9;
const HEAD_TOL = 1e-8;
const MAX_ITERATIONS = 200;
/** Smallest slope of a head-loss curve, psi per gpm, so that a pipe with no flow still couples its nodes. */
const MIN_SLOPE = 1e-9;

export class NetworkSolver {
  private readonly system: SparseSpdSystem;
  private readonly unknown: Int32Array;
  private readonly nUnknown: number;
  private readonly incident: number[][];

  constructor(private readonly model: HydraulicModel) {
    this.unknown = new Int32Array(model.nodes.length).fill(-1);
    let k = 0;
    model.nodes.forEach((_, i) => { if (i !== model.source) this.unknown[i] = k++; });
    this.nUnknown = k;
    const edges: [number, number][] = [];
    for (const p of model.pipes) {
      const a = this.unknown[p.from]!;
      const b = this.unknown[p.to]!;
      if (a >= 0 && b >= 0) edges.push([a, b]);
    }
    this.system = new SparseSpdSystem(k, edges);
    this.incident = model.nodes.map(() => []);
    model.pipes.forEach((p, i) => { this.incident[p.from]!.push(i); this.incident[p.to]!.push(i); });
  }

  /**
   * Pipes that can carry flow with the given heads open: dead ends leading only to closed heads are peeled
   * off (their flow is exactly zero). Returns the live pipes, and for each idle node the node it hangs from.
   */
  private livePart(open?: Uint8Array): { livePipe: Uint8Array; hangsFrom: Int32Array } {
    const { model, incident } = this;
    const livePipe = new Uint8Array(model.pipes.length).fill(1);
    const hangsFrom = new Int32Array(model.nodes.length).fill(-1);
    if (!open) return { livePipe, hangsFrom };
    const pinned = new Uint8Array(model.nodes.length);
    pinned[model.source] = 1;
    model.emitters.forEach((e, k) => { if (open[k]) pinned[e.node] = 1; });
    const degree = Int32Array.from(incident, (l) => l.length);
    const stack: number[] = [];
    degree.forEach((d, v) => { if (d <= 1 && !pinned[v]) stack.push(v); });
    const removed = new Uint8Array(model.nodes.length);
    while (stack.length) {
      const v = stack.pop()!;
      if (removed[v] || pinned[v] || degree[v]! > 1) continue;
      removed[v] = 1;
      for (const k of incident[v]!) {
        if (!livePipe[k]) continue;
        livePipe[k] = 0;
        const p = model.pipes[k]!;
        const w = p.from === v ? p.to : p.from;
        hangsFrom[v] = w;
        if (--degree[w]! <= 1 && !pinned[w]) stack.push(w);
      }
    }
    return { livePipe, hangsFrom };
  }

  /**
   * Solves for a fixed pressure at the source, starting from `warm` when given. `open` says which emitters
   * flow (all when omitted): a closed head is no link at all, so one solver serves many design areas.
   */
  solve(sourcePressure: number, warm?: FlowState, open?: Uint8Array): FlowState {
    const { model, unknown, system } = this;
    const z = (i: number) => PSI_PER_FT * model.nodes[i]!.elevation;
    const fixedHead = sourcePressure + z(model.source);
    const { livePipe, hangsFrom } = this.livePart(open);
    const q = warm ? Float64Array.from(warm.flow) : new Float64Array(model.pipes.length).fill(10);
    livePipe.forEach((live, k) => { if (!live) q[k] = 0; });
    const qe = warm ? Float64Array.from(warm.emitterFlow) : Float64Array.from(model.emitters, (e) => e.k * Math.sqrt(Math.max(sourcePressure, 1)));
    let head: Float64Array = new Float64Array(this.nUnknown);
    let iterations = 0;
    for (; iterations < MAX_ITERATIONS; iterations++) {
      system.clear();
      const rhs = new Float64Array(this.nUnknown);
      const pipeP = new Float64Array(model.pipes.length);
      const pipeY = new Float64Array(model.pipes.length);
      hangsFrom.forEach((w, v) => { if (w >= 0 && unknown[v]! >= 0) system.add(unknown[v]!, unknown[v]!, 1); });
      model.pipes.forEach((p, k) => {
        if (!livePipe[k]) return;
        const aq = Math.abs(q[k]!);
        const slope = Math.max(HW_EXPONENT * p.r * aq ** (HW_EXPONENT - 1), MIN_SLOPE);
        const loss = p.r * aq ** (HW_EXPONENT - 1) * q[k]!;
        const pk = 1 / slope;
        const yk = loss * pk;
        pipeP[k] = pk; pipeY[k] = yk;
        const a = unknown[p.from]!;
        const b = unknown[p.to]!;
        if (a >= 0) { system.add(a, a, pk); rhs[a] = rhs[a]! - (q[k]! - yk); } else if (b >= 0) rhs[b] = rhs[b]! + pk * fixedHead;
        if (b >= 0) { system.add(b, b, pk); rhs[b] = rhs[b]! + (q[k]! - yk); } else if (a >= 0) rhs[a] = rhs[a]! + pk * fixedHead;
        if (a >= 0 && b >= 0) system.add(a, b, -pk);
      });
      const emP = new Float64Array(model.emitters.length);
      const emY = new Float64Array(model.emitters.length);
      model.emitters.forEach((e, k) => {
        if (open && !open[k]) { qe[k] = 0; return; }
        // Emitter as a link to a fixed head at zero pressure: loss (q/K)², slope 2q/K².
        const slope = Math.max((2 * Math.abs(qe[k]!)) / (e.k * e.k), MIN_SLOPE);
        const pk = 1 / slope;
        const yk = ((qe[k]! * Math.abs(qe[k]!)) / (e.k * e.k)) * pk;
        emP[k] = pk; emY[k] = yk;
        const a = unknown[e.node]!;
        if (a >= 0) {
          system.add(a, a, pk);
          rhs[a] = rhs[a]! - (qe[k]! - yk) + pk * z(e.node);
        }
      });
      const next = system.solve(rhs);
      const H = (i: number) => (unknown[i]! >= 0 ? next[unknown[i]!]! : fixedHead);
      let dq = 0;
      let total = 0;
      model.pipes.forEach((p, k) => {
        if (!livePipe[k]) return;
        const nq = q[k]! - pipeY[k]! + pipeP[k]! * (H(p.from) - H(p.to));
        dq += Math.abs(nq - q[k]!);
        total += Math.abs(nq);
        q[k] = nq;
      });
      model.emitters.forEach((e, k) => {
        if (open && !open[k]) return;
        const nq = qe[k]! - emY[k]! + emP[k]! * (H(e.node) - z(e.node));
        dq += Math.abs(nq - qe[k]!);
        total += Math.abs(nq);
        qe[k] = nq;
      });
      let dh = 0;
      for (let i = 0; i < next.length; i++) dh = Math.max(dh, Math.abs(next[i]! - head[i]!));
      head = next;
      if (iterations > 0 && dq <= FLOW_TOL * Math.max(total, 1) && dh <= HEAD_TOL) { iterations++; break; }
    }
    if (iterations >= MAX_ITERATIONS) throw new Error(`hydraulic solve did not converge in ${MAX_ITERATIONS} iterations`);
    // An idle node has the head of the live node it hangs from (no flow, no loss): resolve along the chain.
    const headAt = (i: number): number => {
      let v = i;
      while (hangsFrom[v]! >= 0) v = hangsFrom[v]!;
      return unknown[v]! >= 0 ? head[unknown[v]!]! : fixedHead;
    };
    const pressure = Float64Array.from(model.nodes, (_, i) => headAt(i) - z(i));
    return { pressure, flow: q, emitterFlow: qe, iterations };
  }
}
