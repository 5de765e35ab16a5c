// Steady flow in a sprinkler network by the global gradient method (Todini-Pilati; the method of EPANET):
// Newton iterations on flows and pressures together, heads as emitters q = K·√p, any topology.
//
// The Newton system is kept to the skeleton's anchors: pipes in series are one link (their resistances add,
// exactly, as every Hazen-Williams pipe has the same exponent), and the open heads inside a chain are
// eliminated along it (a tridiagonal solve), so a design area costs what its junctions and open heads cost.

import { PSI_PER_FT } from './hazen-williams.js';
import { EMITTER, HAZEN_WILLIAMS } from './laws.js';
import type { HydraulicModel } from './model.js';
import { buildSkeleton, type Skeleton } from './skeleton.js';
import { SparseSpdSystem } from './sparse-cholesky.js';
import type { NormalPressureDrops } from './velocity-pressure.js';

/** Pressures and flows of the whole model. */
export interface FlowState {
  /** Pressure at each model node, psi. */
  pressure: Float64Array;
  /** Flow in each pipe from `from` to `to`, gpm (negative: the other way). */
  flow: Float64Array;
  /** Flow out of each emitter, gpm (0 for a closed head). */
  emitterFlow: Float64Array;
  iterations: number;
}

/** One solve: the open heads' pressures and flows; `NetworkSolver.expand` gives the whole model's. */
export interface SolveResult {
  /** The open emitters, and the pressure (psi) and flow (gpm) at each. */
  open: Int32Array;
  pressure: Float64Array;
  flow: Float64Array;
  iterations: number;
  /** What `expand` needs; kept only when the solve was asked to keep it. */
  readonly solution: Solution | null;
}

/**
 * Convergence: what the iterations would still change is below 1e-9 of the total flow and 1e-8 psi of head
 * (stated tolerances). It is estimated from the last two steps: a step d after a step d′ contracts by
 * ρ = d/d′, and ρ < ½ leaves at most d·ρ/(1 − ρ) to come (Newton's steps shrink far faster than that).
 */
const FLOW_TOL = 1e-9;
const HEAD_TOL = 1e-8;
const MAX_CONTRACTION = 0.5;
const remaining = (step: number, previous: number): number => {
  const rho = step / previous;
  return rho < MAX_CONTRACTION ? (step * rho) / (1 - rho) : step;
};

/** What an iteration changed: the sum of flow changes, the largest head change, and the total flow. */
interface Change {
  flow: number;
  head: number;
  totalFlow: number;
}

const converged = (change: Change, previous: Change): boolean =>
  remaining(change.flow, previous.flow) <= FLOW_TOL * Math.max(change.totalFlow, 1) && remaining(change.head, previous.head) <= HEAD_TOL;
const MAX_ITERATIONS = 200;
/**
 * Least slope of a link's loss curve in the Newton step, psi per gpm. Near zero flow the Hazen-Williams slope
 * vanishes and the step would amplify rounding without end; the floor damps the step there and leaves the
 * converged flows, which satisfy the exact loss law, unchanged.
 */
const MIN_SLOPE = 1e-5;
/** One link's loss and slope at its present flow, as its law writes them (the solver runs on one thread). */
const law = new Float64Array(2);
/** First guess of the flow in a chain not solved before, gpm. */
const COLD_FLOW = 10;

/**
 * The chains and anchors that carry flow with a given set of open heads, in flat arrays. Live chain i has
 * open heads headStart[i] .. headStart[i + 1] − 1 and segments headStart[i] + i .. headStart[i + 1] + i:
 * segment j runs from point j to point j + 1, where point 0 is anchor a, point h + 1 open head h, and the
 * last point anchor b. A segment to an unlinked end (a dead end past the last open head) carries nothing.
 */
interface LivePart {
  chain: Int32Array;
  aLinked: Uint8Array;
  bLinked: Uint8Array;
  headStart: Int32Array;
  headIndex: Int32Array;
  headEmitter: Int32Array;
  liveAnchor: Uint8Array;
  anchorEmitters: Int32Array;
  /** Anchors peeled off as dead ends, in order, each with the chain it hangs on (−1: none). */
  peeledAnchor: Int32Array;
  peeledChain: Int32Array;
  /** Live chain of each skeleton chain, or −1. */
  liveIndex: Int32Array;
  /** The anchor system's columns of the live anchors, or null when all are live (see SparseSpdSystem.solve). */
  columns: Int32Array | null;
}

/**
 * A live part that outlives the next solve. The arrays sized by the whole skeleton are the workspace's (a solve
 * of a few heads on a system of thousands would otherwise allocate them each time), so a kept solve copies them.
 */
const detached = (live: LivePart): LivePart => ({
  ...live,
  liveAnchor: live.liveAnchor.slice(),
  peeledAnchor: live.peeledAnchor.slice(),
  peeledChain: live.peeledChain.slice(),
  liveIndex: live.liveIndex.slice(),
});

/** One solve in progress: its live part, the solver's buffers, the counts that size them, the source's head. */
interface Iteration {
  live: LivePart;
  w: Workspace;
  /** Live chains, open heads on chains, open heads on anchors, anchors. */
  L: number;
  T: number;
  nE: number;
  nA: number;
  sourceHead: number;
  iterations: number;
}

interface Solution {
  live: LivePart;
  /** The deductions the solve was made with (null: none). */
  drops: NormalPressureDrops | null;
  anchorHead: Float64Array;
  headPotential: Float64Array;
  segmentFlow: Float64Array;
}

export class NetworkSolver {
  readonly skeleton: Skeleton;
  private readonly system: SparseSpdSystem;
  /** Where each emitter sits: its anchor, or its chain and interior index. */
  private readonly emitterAnchor: Int32Array;
  private readonly emitterChain: Int32Array;
  private readonly emitterIndex: Int32Array;
  /** End anchors of each skeleton chain. */
  private readonly chainA: Int32Array;
  private readonly chainB: Int32Array;
  /** Matrix slots of each anchor's diagonal, and of each chain's (a, b) entry (−1 when it has none). */
  private readonly diagSlot: Int32Array;
  private readonly pairSlot: Int32Array;
  /** Warm start: each chain's flow at its a end, and each emitter's flow, from the last solve that had them. */
  private readonly lastChainFlow: Float64Array;
  private readonly lastEmitterFlow: Float64Array;
  private work: Workspace;
  /**
   * Pressure each open head and each pipe entry deducts (normal pressure; null: none, total pressure). The solver
   * takes them as fixed; whoever wants them consistent with the flows sets them again from the solve and repeats.
   */
  drops: NormalPressureDrops | null = null;

  constructor(readonly model: HydraulicModel) {
    const sk = (this.skeleton = buildSkeleton(model));
    const couples = (a: number, b: number) => a !== sk.source && b !== sk.source && a !== b;
    const edges = sk.chains.filter((c) => couples(c.a, c.b)).map((c) => [c.a - 1, c.b - 1] as [number, number]);
    const system = (this.system = new SparseSpdSystem(sk.anchorNode.length - 1, edges));
    this.diagSlot = Int32Array.from(sk.anchorNode, (_, v) => (v === sk.source ? -1 : system.slot(v - 1, v - 1)));
    this.pairSlot = Int32Array.from(sk.chains, (c) => (couples(c.a, c.b) ? system.slot(c.a - 1, c.b - 1) : -1));
    this.emitterAnchor = Int32Array.from(model.emitters, (e) => sk.anchorOf[e.node]!);
    this.emitterChain = Int32Array.from(model.emitters, (e) => sk.chainOf[e.node]!);
    this.emitterIndex = Int32Array.from(model.emitters, (e) => sk.indexInChain[e.node]!);
    this.chainA = Int32Array.from(sk.chains, (c) => c.a);
    this.chainB = Int32Array.from(sk.chains, (c) => c.b);
    this.lastChainFlow = new Float64Array(sk.chains.length).fill(Number.NaN);
    this.lastEmitterFlow = new Float64Array(model.emitters.length).fill(Number.NaN);
    // Sized for a few dozen open heads at first (a design area), grown when a solve opens more.
    this.work = workspace(Math.min(model.emitters.length, 64), sk.chains.length, sk.anchorNode.length);
  }

  /** The live part with the given emitters open. */
  private livePart(openList: Int32Array): LivePart {
    const { skeleton: sk, emitterAnchor, emitterChain, emitterIndex } = this;
    const nC = sk.chains.length;
    const { pinned, alive, aLink, bLink, headCount } = this.work;
    pinned.fill(0);
    pinned[sk.source] = 1;
    headCount.fill(0);
    const anchorEmitters: number[] = [];
    const chainHeads: number[] = [];
    for (const k of openList) {
      const anchor = emitterAnchor[k]!;
      if (anchor >= 0) {
        pinned[anchor] = 1;
        anchorEmitters.push(k);
      } else {
        chainHeads.push(k);
        headCount[emitterChain[k]!]!++;
      }
    }
    chainHeads.sort((x, y) => emitterChain[x]! - emitterChain[y]! || emitterIndex[x]! - emitterIndex[y]!);
    const peeled = this.peelDeadEnds(pinned, headCount);
    const chain: number[] = [];
    const headStart: number[] = [0];
    const liveIndex = this.work.liveIndex.fill(-1);
    let next = 0;
    for (let i = 0; i < nC; i++) {
      const heads = headCount[i]!;
      if (!alive[i] || (!heads && !(aLink[i] && bLink[i]))) continue;
      if (heads && !aLink[i] && !bLink[i]) throw new Error('open heads are not connected to the source');
      next += heads;
      liveIndex[i] = chain.length;
      chain.push(i);
      headStart.push(next);
    }
    const liveChain = Int32Array.from(chain);
    const linked = (flags: Uint8Array) => {
      const out = new Uint8Array(chain.length);
      chain.forEach((c, i) => {
        out[i] = flags[c]!;
      });
      return out;
    };
    const headEmitter = Int32Array.from(chainHeads);
    // The anchor system is factored over the live anchors alone where some were peeled (a few heads open on a
    // large tree leave most idle); a grid, where none is, keeps the whole system without listing it each solve.
    let columns: Int32Array | null = null;
    if (peeled > 0) {
      const liveAnchors: number[] = [];
      for (let v = 0; v < sk.anchorNode.length; v++) if (v !== sk.source && this.work.liveAnchor[v]) liveAnchors.push(v - 1);
      columns = this.system.columnsOf(liveAnchors);
    }
    return {
      chain: liveChain,
      aLinked: linked(aLink),
      bLinked: linked(bLink),
      headStart: Int32Array.from(headStart),
      headIndex: headEmitter.map((k) => emitterIndex[k]!),
      headEmitter,
      liveAnchor: this.work.liveAnchor,
      anchorEmitters: Int32Array.from(anchorEmitters),
      peeledAnchor: this.work.peeledAnchor.subarray(0, peeled),
      peeledChain: this.work.peeledChain.subarray(0, peeled),
      liveIndex,
      columns,
    };
  }

  /**
   * Peels dead ends: an anchor with one live chain end or none, no open head and no source is idle; a chain
   * without open heads that loses an end carries nothing; one with open heads stops at its last open head.
   * Leaves `alive`, `aLink`, `bLink` and `liveAnchor` of the workspace set, and the peeled anchors in order in
   * `peeledAnchor` and `peeledChain`; returns how many were peeled.
   */
  private peelDeadEnds(pinned: Uint8Array, headCount: Int32Array): number {
    const { skeleton: sk, chainA, chainB } = this;
    const nA = sk.anchorNode.length;
    const nC = sk.chains.length;
    const { alive, aLink, bLink, degree, liveAnchor, peeledAnchor, peeledChain, stack } = this.work;
    degree.fill(0);
    for (let i = 0; i < nC; i++) {
      const on = chainA[i] !== chainB[i] || headCount[i]! > 0 ? 1 : 0;
      alive[i] = aLink[i] = bLink[i] = on;
      if (on) {
        degree[chainA[i]!]!++;
        degree[chainB[i]!]!++;
      }
    }
    liveAnchor.fill(1);
    // An anchor is pushed once at first and once each time a chain at it dies: nA + nC slots hold them all.
    let top = 0;
    for (let v = 0; v < nA; v++) if (degree[v]! <= 1 && !pinned[v]) stack[top++] = v;
    let peeled = 0;
    while (top > 0) {
      const v = stack[--top]!;
      if (!liveAnchor[v] || pinned[v] || degree[v]! > 1) continue;
      liveAnchor[v] = 0;
      let on = -1;
      for (const i of sk.chainsAt[v]!)
        if (alive[i] && ((chainA[i] === v && aLink[i]) || (chainB[i] === v && bLink[i]))) {
          on = i;
          break;
        }
      peeledAnchor[peeled] = v;
      peeledChain[peeled++] = on;
      if (on < 0) continue;
      const atA = chainA[on] === v;
      if (atA) aLink[on] = 0;
      else bLink[on] = 0;
      if (headCount[on]! > 0) continue;
      alive[on] = 0;
      const w = atA ? chainB[on]! : chainA[on]!;
      if (atA ? bLink[on] : aLink[on]) {
        if (atA) bLink[on] = 0;
        else aLink[on] = 0;
        if (--degree[w]! <= 1 && !pinned[w]) stack[top++] = w;
      }
    }
    return peeled;
  }

  /**
   * Solves for a fixed pressure at the source, warm from the last solve. `open` lists the emitters that flow
   * (all when omitted): a closed head is no link at all, so one solver serves many design areas. `keep`
   * keeps what `expand` needs (a trial solve that is only checked does without). An iteration is EPANET's:
   * each link's coefficients from its law, the anchor system assembled, solved, new flows, converged?
   */
  solve(sourcePressure: number, open?: Int32Array, keep = true): SolveResult {
    const it = this.start(sourcePressure, open ?? Int32Array.from(this.model.emitters, (_, k) => k));
    for (let previous: Change = { flow: Infinity, head: Infinity, totalFlow: 0 }; ; ) {
      this.coefficients(it);
      this.assemble(it);
      const anchorHeads = this.system.solve(it.w.rhs.subarray(0, it.nA - 1), it.w.solved, it.live.columns);
      const change = this.updateFlows(it, anchorHeads);
      it.iterations++;
      if (it.iterations > 1 && converged(change, previous)) break;
      if (it.iterations >= MAX_ITERATIONS) throw new Error(`hydraulic solve did not converge in ${MAX_ITERATIONS} iterations`);
      previous = change;
    }
    return this.results(it, keep);
  }

  /** The live part, and each open head's and segment's starting flow (warm from the last solve that had it). */
  private start(sourcePressure: number, openList: Int32Array): Iteration {
    const { model, skeleton: sk } = this;
    const live = this.livePart(openList);
    const { chain, aLinked, bLinked, headStart, headIndex, headEmitter, anchorEmitters } = live;
    const T = headEmitter.length;
    const nE = anchorEmitters.length;
    if (Math.max(T, nE) > this.work.qH.length) this.work = workspace(Math.max(T, nE), sk.chains.length, sk.anchorNode.length);
    const w = this.work;
    const zOf = (node: number) => PSI_PER_FT * model.nodes[node]!.elevation;
    const firstFlow = (k: number) => {
      const last = this.lastEmitterFlow[k]!;
      return Number.isFinite(last) ? last : model.emitters[k]!.k * Math.sqrt(Math.max(model.emitters[k]!.required, 1));
    };
    for (let h = 0; h < T; h++) {
      const k = headEmitter[h]!;
      w.qH[h] = firstFlow(k);
      w.kH[h] = model.emitters[k]!.k;
      w.zH[h] = zOf(model.emitters[k]!.node) + (this.drops?.emitter[k] ?? 0);
    }
    for (let e = 0; e < nE; e++) {
      const k = anchorEmitters[e]!;
      w.qA[e] = firstFlow(k);
      w.kA[e] = model.emitters[k]!.k;
      w.zA[e] = zOf(model.emitters[k]!.node) + (this.drops?.emitter[k] ?? 0);
      w.atA[e] = this.emitterAnchor[k]!;
    }
    // Segments of each live chain: resistance, whether it reaches a linked end, and a first flow.
    for (let i = 0; i < chain.length; i++) {
      const c = sk.chains[chain[i]!]!;
      w.endA[i] = c.a;
      w.endB[i] = c.b;
      const h0 = headStart[i]!;
      const m = headStart[i + 1]! - h0;
      const base = h0 + i;
      let total = 0;
      for (let h = h0; h < h0 + m; h++) total += w.qH[h]!;
      const last = this.lastChainFlow[chain[i]!]!;
      let flow = !aLinked[i] ? 0 : !bLinked[i] ? total : Number.isFinite(last) ? last : m ? total / 2 : COLD_FLOW;
      for (let j = 0; j <= m; j++) {
        const from = j === 0 ? 0 : headIndex[h0 + j - 1]! + 1;
        const to = j === m ? c.nodes.length + 1 : headIndex[h0 + j]! + 1;
        w.segR[base + j] = c.cumR[to]! - c.cumR[from]!;
        w.segD[base + j] = this.drops ? chainDrop(this.drops.pipe, c, from, to) : 0;
        w.segOn[base + j] = (j === 0 && !aLinked[i]) || (j === m && !bLinked[i]) ? 0 : 1;
        w.q[base + j] = w.segOn[base + j] ? flow : 0;
        if (j < m) flow -= w.qH[h0 + j]!;
      }
    }
    w.H.fill(0, 0, T);
    w.anchorHead.fill(0);
    return {
      live,
      w,
      L: chain.length,
      T,
      nE,
      nA: sk.anchorNode.length,
      sourceHead: sourcePressure + zOf(sk.anchorNode[sk.source]!),
      iterations: 0,
    };
  }

  /** Each link linearised at its present flow by its own law: flow = g·(head difference) + s. */
  private coefficients(it: Iteration): void {
    const { w, T, nE, L } = it;
    linearizeEmitters(w.qA, w.kA, w.zA, w.gA, w.cA, nE);
    linearizeEmitters(w.qH, w.kH, w.zH, w.gE, w.cE, T);
    const segments = T + L;
    for (let x = 0; x < segments; x++) {
      if (!w.segOn[x]) {
        w.g[x] = 0;
        w.s[x] = 0;
        continue;
      }
      const qx = w.q[x]!;
      HAZEN_WILLIAMS.lossAndSlope(w.segR[x]!, qx, law);
      const gx = 1 / Math.max(law[1]!, MIN_SLOPE);
      w.g[x] = gx;
      w.s[x] = qx - (law[0]! + w.segD[x]!) * gx;
    }
  }

  /**
   * The anchor system: each live chain, its open heads eliminated, is a two-port between its end anchors
   * (outflow at a: pA·H_a + pAB·H_b + cPa; at b: pBA·H_a + pB·H_b + cPb); anchor heads and idle anchors too.
   */
  private assemble(it: Iteration): void {
    const { system, diagSlot, pairSlot, skeleton: sk } = this;
    const { w, live, L, nE, nA, sourceHead } = it;
    const { chain, aLinked, bLinked, headStart } = live;
    const { g, s, gE, cE, x0, xa, xb, rhs } = w;
    const src = sk.source;
    system.clear(live.columns);
    rhs.fill(0, 0, nA - 1);
    for (let e = 0; e < nE; e++) {
      const v = w.atA[e]!;
      if (v === src) continue;
      system.addAt(diagSlot[v]!, w.gA[e]!);
      rhs[v - 1] = rhs[v - 1]! - w.cA[e]!;
    }
    for (let i = 0; i < L; i++) {
      const h0 = headStart[i]!;
      const m = headStart[i + 1]! - h0;
      const base = h0 + i;
      let pA: number, pB: number, pAB: number, pBA: number, cPa: number, cPb: number;
      if (m === 0) {
        pA = pB = g[base]!;
        pAB = pBA = -g[base]!;
        cPa = s[base]!;
        cPb = -s[base]!;
      } else {
        eliminateHeads(g, s, base, gE, cE, h0, m, w.pivot, x0, xa, xb);
        const gFirst = g[base]!;
        const gLast = g[base + m]!;
        const hl = h0 + m - 1;
        pA = gFirst * (1 - xa[h0]!);
        pAB = -gFirst * xb[h0]!;
        cPa = s[base]! - gFirst * x0[h0]!;
        pBA = -gLast * xa[hl]!;
        pB = gLast * (1 - xb[hl]!);
        cPb = -s[base + m]! - gLast * x0[hl]!;
      }
      const a = w.endA[i]!;
      const b = w.endB[i]!;
      const la = aLinked[i] === 1;
      const lb = bLinked[i] === 1;
      if (la && lb && a === b) {
        if (a !== src) {
          system.addAt(diagSlot[a]!, pA + pAB + pBA + pB);
          rhs[a - 1] = rhs[a - 1]! - cPa - cPb;
        }
        continue;
      }
      if (la && a !== src) {
        system.addAt(diagSlot[a]!, pA);
        rhs[a - 1] = rhs[a - 1]! - cPa - (lb && b === src ? pAB * sourceHead : 0);
      }
      if (lb && b !== src) {
        system.addAt(diagSlot[b]!, pB);
        rhs[b - 1] = rhs[b - 1]! - cPb - (la && a === src ? pBA * sourceHead : 0);
      }
      if (la && lb && a !== src && b !== src) system.addAt(pairSlot[chain[i]!]!, (pAB + pBA) / 2);
    }
  }

  /** New anchor heads from the linear solve, then the heads along chains and every link's new flow; the change. */
  private updateFlows(it: Iteration, solved: Float64Array): Change {
    const { w, live, L, nE, nA, sourceHead } = it;
    const { aLinked, bLinked, headStart, liveAnchor } = live;
    const src = this.skeleton.source;
    const { anchorHead, nextAnchor, H, nextH, q, qH, qA, g, s, gE, cE, x0, xa, xb, segOn } = w;
    let head = 0;
    for (let v = 0; v < nA; v++) {
      nextAnchor[v] = v === src ? sourceHead : liveAnchor[v] ? solved[v - 1]! : 0;
      head = Math.max(head, Math.abs(nextAnchor[v]! - anchorHead[v]!));
    }
    let dq = 0;
    let total = 0;
    for (let i = 0; i < L; i++) {
      const h0 = headStart[i]!;
      const m = headStart[i + 1]! - h0;
      const base = h0 + i;
      const Ha = aLinked[i] ? nextAnchor[w.endA[i]!]! : 0;
      const Hb = bLinked[i] ? nextAnchor[w.endB[i]!]! : 0;
      for (let h = h0; h < h0 + m; h++) {
        const Hh = x0[h]! + xa[h]! * Ha + xb[h]! * Hb;
        nextH[h] = Hh;
        head = Math.max(head, Math.abs(Hh - H[h]!));
        const nq = gE[h]! * Hh + cE[h]!;
        dq += Math.abs(nq - qH[h]!);
        total += Math.abs(nq);
        qH[h] = nq;
      }
      for (let j = 0; j <= m; j++) {
        const x = base + j;
        if (!segOn[x]) continue;
        const left = j === 0 ? Ha : nextH[h0 + j - 1]!;
        const right = j === m ? Hb : nextH[h0 + j]!;
        const nq = g[x]! * (left - right) + s[x]!;
        dq += Math.abs(nq - q[x]!);
        total += Math.abs(nq);
        q[x] = nq;
      }
    }
    for (let e = 0; e < nE; e++) {
      const nq = w.gA[e]! * nextAnchor[w.atA[e]!]! + w.cA[e]!;
      dq += Math.abs(nq - qA[e]!);
      total += Math.abs(nq);
      qA[e] = nq;
    }
    // This iteration's heads become the present ones (the buffers swap).
    [w.anchorHead, w.nextAnchor] = [nextAnchor, anchorHead];
    [w.H, w.nextH] = [nextH, H];
    return { flow: dq, head, totalFlow: total };
  }

  /** The open heads' pressures and flows; the warm start for the next solve; what `expand` needs when kept. */
  private results(it: Iteration, keep: boolean): SolveResult {
    const { w, live, L, T, nE, nA } = it;
    const { chain, aLinked, headStart, headEmitter, anchorEmitters } = live;
    for (let i = 0; i < L; i++) this.lastChainFlow[chain[i]!] = aLinked[i] ? w.q[headStart[i]! + i]! : Number.NaN;
    const pressure = new Float64Array(nE + T);
    const flow = new Float64Array(nE + T);
    const openOut = new Int32Array(nE + T);
    const put = (x: number, k: number, head: number, qk: number, z: number) => {
      openOut[x] = k;
      pressure[x] = head - z;
      flow[x] = qk;
      this.lastEmitterFlow[k] = qk;
    };
    for (let e = 0; e < nE; e++) put(e, anchorEmitters[e]!, w.anchorHead[w.atA[e]!]!, w.qA[e]!, w.zA[e]!);
    for (let h = 0; h < T; h++) put(nE + h, headEmitter[h]!, w.H[h]!, w.qH[h]!, w.zH[h]!);
    const solution = keep
      ? {
          live: detached(live),
          drops: this.drops,
          anchorHead: w.anchorHead.slice(0, nA),
          headPotential: w.H.slice(0, T),
          segmentFlow: w.q.slice(0, T + L),
        }
      : null;
    return { open: openOut, pressure, flow, iterations: it.iterations, solution };
  }

  /** Pressures at every model node and flows in every pipe, from a solve: idle parts take the head they hang from. */
  expand(result: SolveResult): FlowState {
    const { model, skeleton: sk } = this;
    if (!result.solution) throw new Error('the solve did not keep its solution');
    const { live, drops, anchorHead, headPotential, segmentFlow } = result.solution;
    const H = new Float64Array(model.nodes.length);
    const flow = new Float64Array(model.pipes.length);
    const Hanchor = Float64Array.from(anchorHead);
    // Along a live chain, pipe by pipe; a dangling tail carries nothing and keeps its open head's head.
    live.chain.forEach((ci, i) => {
      const c = sk.chains[ci]!;
      const h0 = live.headStart[i]!;
      const m = live.headStart[i + 1]! - h0;
      for (let j = 0; j <= m; j++) {
        const from = j === 0 ? 0 : live.headIndex[h0 + j - 1]! + 1;
        const to = j === m ? c.nodes.length + 1 : live.headIndex[h0 + j]! + 1;
        const linked = !((j === 0 && !live.aLinked[i]) || (j === m && !live.bLinked[i]));
        const q = linked ? segmentFlow[h0 + i + j]! : 0;
        let h = j === 0 ? (live.aLinked[i] ? Hanchor[c.a]! : headPotential[h0]!) : headPotential[h0 + j - 1]!;
        for (let x = from; x < to; x++) {
          const k = c.pipes[x]!;
          flow[k] = q * c.sign[x]!;
          h -= HAZEN_WILLIAMS.loss(model.pipes[k]!.r, q) + (drops && linked ? drops.pipe[k]! * c.sign[x]! : 0);
          if (x < c.nodes.length) H[c.nodes[x]!] = h;
        }
      }
    });
    // Peeled anchors, last first: each has the head of what it hangs on (a dangling chain's nearest open head,
    // or the far anchor of a dead chain, whose own head is known by then).
    for (let x = live.peeledAnchor.length - 1; x >= 0; x--) {
      const anchor = live.peeledAnchor[x]!;
      const chain = live.peeledChain[x]!;
      if (chain < 0) continue;
      const c = sk.chains[chain]!;
      const li = live.liveIndex[chain]!;
      if (li < 0) {
        Hanchor[anchor] = Hanchor[c.a === anchor ? c.b : c.a]!;
        continue;
      }
      const h0 = live.headStart[li]!;
      Hanchor[anchor] = headPotential[c.a === anchor ? h0 : live.headStart[li + 1]! - 1]!;
    }
    sk.chains.forEach((c, i) => {
      if (live.liveIndex[i]! < 0) for (const v of c.nodes) H[v] = Hanchor[c.a]!;
    });
    sk.anchorNode.forEach((v, a) => {
      H[v] = Hanchor[a]!;
    });
    const pressure = Float64Array.from(model.nodes, (node, v) => H[v]! - PSI_PER_FT * node.elevation);
    const emitterFlow = new Float64Array(model.emitters.length);
    result.open.forEach((k, x) => {
      emitterFlow[k] = result.flow[x]!;
    });
    return { pressure, flow, emitterFlow, iterations: result.iterations };
  }
}

/** The deductions at pipe entries along chain positions from … to, in the chain's a → b sense. */
function chainDrop(pipeDrop: Float64Array, c: Skeleton['chains'][number], from: number, to: number): number {
  let d = 0;
  for (let x = from; x < to; x++) d += pipeDrop[c.pipes[x]!]! * c.sign[x]!;
  return d;
}

/** Heads as links to the atmosphere at their own elevation z, linearised by the emitter law: q = g·H + c. */
function linearizeEmitters(q: Float64Array, k: Float64Array, z: Float64Array, g: Float64Array, c: Float64Array, n: number): void {
  for (let e = 0; e < n; e++) {
    EMITTER.lossAndSlope(k[e]!, q[e]!, law);
    const ge = 1 / Math.max(law[1]!, MIN_SLOPE);
    g[e] = ge;
    c[e] = q[e]! - law[0]! * ge - ge * z[e]!;
  }
}

/** Buffers of one solver, sized for every head open and every chain live, reused by each solve. */
type Workspace = ReturnType<typeof workspace>;

function workspace(emitters: number, chains: number, anchors: number) {
  const f = (n: number) => new Float64Array(n);
  return {
    // open heads on chains: flow, K, elevation head, linearization, elimination, potential now and next
    qH: f(emitters),
    kH: f(emitters),
    zH: f(emitters),
    gE: f(emitters),
    cE: f(emitters),
    pivot: f(emitters),
    x0: f(emitters),
    xa: f(emitters),
    xb: f(emitters),
    H: f(emitters),
    nextH: f(emitters),
    // open heads on anchors
    qA: f(emitters),
    kA: f(emitters),
    zA: f(emitters),
    gA: f(emitters),
    cA: f(emitters),
    atA: new Int32Array(emitters),
    // segments of live chains, and the chains' end anchors
    segR: f(emitters + chains),
    /** What the pipes' entries deduct along each segment, in the chain's a → b sense (normal pressure). */
    segD: f(emitters + chains),
    q: f(emitters + chains),
    g: f(emitters + chains),
    s: f(emitters + chains),
    segOn: new Uint8Array(emitters + chains),
    endA: new Int32Array(chains),
    endB: new Int32Array(chains),
    // the anchor system
    rhs: f(anchors),
    solved: f(anchors),
    anchorHead: f(anchors),
    nextAnchor: f(anchors),
    // finding the live part
    pinned: new Uint8Array(anchors),
    degree: new Int32Array(anchors),
    alive: new Uint8Array(chains),
    aLink: new Uint8Array(chains),
    bLink: new Uint8Array(chains),
    headCount: new Int32Array(chains),
    liveAnchor: new Uint8Array(anchors),
    peeledAnchor: new Int32Array(anchors),
    peeledChain: new Int32Array(anchors),
    stack: new Int32Array(anchors + chains),
    liveIndex: new Int32Array(chains),
  };
}

/**
 * Eliminates a chain's m open heads, a tridiagonal system, from the linearized segments g·(H_left − H_right) + s
 * (m + 1 of them from `base`) and emitters gE·H + cE (from `h0`): afterwards each head's potential is
 * x0 + xa·H_a + xb·H_b. Head h lies between segment h and segment h + 1 of the chain.
 */
function eliminateHeads(
  g: Float64Array,
  s: Float64Array,
  base: number,
  gE: Float64Array,
  cE: Float64Array,
  h0: number,
  m: number,
  w: Float64Array,
  x0: Float64Array,
  xa: Float64Array,
  xb: Float64Array,
): void {
  for (let i = 0; i < m; i++) {
    const h = h0 + i;
    w[h] = g[base + i]! + g[base + i + 1]! + gE[h]!;
    x0[h] = s[base + i]! - s[base + i + 1]! - cE[h]!;
    xa[h] = i === 0 ? g[base]! : 0;
    xb[h] = i === m - 1 ? g[base + m]! : 0;
  }
  for (let i = 1; i < m; i++) {
    const h = h0 + i;
    const f = g[base + i]! / w[h - 1]!;
    w[h] = w[h]! - f * g[base + i]!;
    x0[h] = x0[h]! + f * x0[h - 1]!;
    xa[h] = xa[h]! + f * xa[h - 1]!;
    xb[h] = xb[h]! + f * xb[h - 1]!;
  }
  const last = h0 + m - 1;
  x0[last] = x0[last]! / w[last]!;
  xa[last] = xa[last]! / w[last]!;
  xb[last] = xb[last]! / w[last]!;
  for (let i = m - 2; i >= 0; i--) {
    const h = h0 + i;
    const gr = g[base + i + 1]!;
    x0[h] = (x0[h]! + gr * x0[h + 1]!) / w[h]!;
    xa[h] = (xa[h]! + gr * xa[h + 1]!) / w[h]!;
    xb[h] = (xb[h]! + gr * xb[h + 1]!) / w[h]!;
  }
}
