// The K-factor balancing walk on tree systems, from the heads to the source: with exponent ½ the classic hand
// method; with 1/1.85 a safe upper bound on the demand, which prunes the design-area search.

import { HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import type { Emitter, HydraulicModel } from './model.js';
import { buildSkeleton, type Skeleton } from './skeleton.js';
import { maxOf, minOf } from '../arrays.js';

export interface Demand {
  pressure: number;
  flow: number;
}

export interface TreeBound {
  /** Upper bounds on the required source pressure (psi) and the source flow (gpm), or null where none holds. */
  bound(headIds: string[]): Demand | null;
  /**
   * Upper bounds that hold for every set `base` ∪ `run`, where a run is `size` heads in a row of `line` starting at
   * `first` … `last` (the placements of a design area's leftover heads): the runs, summed up where the line's water
   * first meets other water, enter the walk as one input that asks at least the pressure of each and, at any higher
   * pressure, draws at least the flow of each. `line` is the heads of a line in order, the same array every call.
   */
  boundAlong(base: string[], line: readonly string[], first: number, last: number, size: number): Demand | null;
}

/**
 * Why it is an upper bound: a subtree of pipes (loss ∝ Q^1.85) and heads (loss ∝ Q²) in series and parallel has
 * d ln Q / d ln p between 1/2 and 1/1.85, so raising its inlet pressure by s ≥ 1 raises its flow by at most s^(1/1.85).
 * The hand method's √s (exact for a lone head) becomes s^(1/1.85); by induction from the heads up, each node's
 * pressure is at least the least pressure that satisfies its heads, and its flow at least the true flow at that
 * pressure, so the source pressure and flow are bounded above. Static head between junctions would break the
 * elasticity argument, so the bound is given only where every node below the source is at one elevation.
 */
const BOUND_EXPONENT = 1 / HW_EXPONENT;
/** The classic hand method scales the lower side's flow by √(p_high/p_low) (the K-factor balancing method of hand calculations, confirmed by a trade primer). */
export const HAND_METHOD_EXPONENT = 0.5;

export const treeBound = (model: HydraulicModel, skeleton?: Skeleton): TreeBound | null => kFactorWalk(model, BOUND_EXPONENT, skeleton);

/**
 * The K-factor balancing walk over a tree model, raising lower-pressure sides by (p_high/p_low)^exponent. It
 * walks the model's skeleton: along a chain of pipes with no open head between, the flow is constant and the
 * losses of its pipes add up, so a design area costs its heads and the junctions on their way to the source.
 */
export function kFactorWalk(model: HydraulicModel, raiseExponent: number, skeleton?: Skeleton): TreeBound | null {
  const n = model.nodes.length;
  if (model.pipes.length !== n - 1) return null;
  const sk = skeleton ?? buildSkeleton(model);
  const nA = sk.anchorNode.length;
  const nC = sk.chains.length;
  // Orient the skeleton from the source: each anchor's chain and anchor towards the source, and its rank.
  const upChain = new Int32Array(nA).fill(-1);
  const upAnchor = new Int32Array(nA).fill(-1);
  const rank = new Int32Array(nA);
  const order = [sk.source];
  const seen = new Uint8Array(nA);
  seen[sk.source] = 1;
  for (let i = 0; i < order.length; i++) {
    const u = order[i]!;
    rank[u] = i;
    for (const c of sk.chainsAt[u]!) {
      const chain = sk.chains[c]!;
      const v = chain.a === u ? chain.b : chain.a;
      if (seen[v]) continue;
      seen[v] = 1;
      upChain[v] = c;
      upAnchor[v] = u;
      order.push(v);
    }
  }
  if (order.length !== nA) return null;
  // Elevations: the bound holds where every node below the source is at one level (see BOUND_EXPONENT).
  const z = (v: number) => model.nodes[v]!.elevation;
  const anchorZ = Float64Array.from(sk.anchorNode, z);
  const chainZ = sk.chains.map((c) => {
    const zs = Array.from(c.nodes, z);
    return zs.length && maxOf(zs) - minOf(zs) > 1e-9 ? Number.NaN : (zs[0] ?? null);
  });
  const emitterOf = new Map(model.emitters.map((e) => [e.headId, e]));
  // The way from each anchor to the source, summed once: its chains' resistance and the one level of its anchors
  // and chains (null: none; NaN: mixed). Past the anchor where all of an area's water has met, a walk jumps to the
  // source with these instead of touching each anchor of a long cross main on the way.
  const pathR = new Float64Array(nA);
  const pathLevel: (number | null)[] = new Array(nA).fill(null);
  const depth = new Int32Array(nA);
  for (const v of order) {
    const u = upAnchor[v]!;
    if (u < 0) continue;
    const c = sk.chains[upChain[v]!]!;
    pathR[v] = pathR[u]! + c.cumR[c.pipes.length]!;
    pathLevel[v] = sameLevel(sameLevel(anchorZ[v]!, chainZ[upChain[v]!]!), pathLevel[u]!);
    depth[v] = depth[u]! + 1;
  }
  const lift = ancestorTable(upAnchor, depth, order);
  // Per-call scratch, reused: each anchor's combined (pressure, flow) and the call that last touched it; each
  // chain's open heads (interior index, emitter) and the call that gave them. A flow that passes anchors
  // without joining another keeps its pipes' resistance R pending: its pressure there is P + R·Q^1.85, one
  // power evaluated where it meets other water instead of one per pipe run.
  const P = new Float64Array(nA);
  const Q = new Float64Array(nA);
  const R = new Float64Array(nA);
  const stamp = new Int32Array(nA);
  const touchedRanks = new Int32Array(nA);
  const chainStamp = new Int32Array(nC);
  // A chain's open heads, in order along it: how many, their interior indices and emitters (parallel lists,
  // reused: their lengths only grow, since shortening an array gives its storage up).
  const chainHeadCount = new Int32Array(nC);
  const chainHeadIndex: number[][] = sk.chains.map(() => []);
  const chainHeadEmitter: Emitter[][] = sk.chains.map(() => []);
  const heads: Emitter[] = [];
  let headCount = 0;
  let epoch = 0;
  let touched = 0;
  // Numbers that change per call live in a typed array: a number captured by these closures and reassigned
  // would be boxed anew on every write. [0, 1]: the running join's pressure and flow; [2]: the one elevation
  // of every node reached this call, once `levelSeen`.
  const scratch = new Float64Array(3);
  let levelSeen = false;
  /** a^x for a > 0 (exp and log: twice as fast as the power operator in V8). */
  const pow = (a: number, x: number) => Math.exp(x * Math.log(a));
  /** Adds an input (p, q) to the running join (scratch[0], scratch[1]): the higher pressure wins, the other side's flow is
   * raised to it. */
  const join = (p: number, q: number) => {
    const jp = scratch[0]!;
    const jq = scratch[1]!;
    if (jq === 0) {
      scratch[0] = p;
      scratch[1] = q;
    } else if (p <= jp) scratch[1] = jq + q * pow(jp / p, raiseExponent);
    else {
      scratch[1] = jq * pow(p / jp, raiseExponent) + q;
      scratch[0] = p;
    }
  };
  const atLevel = (h: number | null) => {
    if (h === null) return true;
    if (Number.isNaN(h)) return false;
    if (!levelSeen) {
      scratch[2] = h;
      levelSeen = true;
    }
    return Math.abs(h - scratch[2]!) <= 1e-9;
  };
  /**
   * Marks the anchors from `from` up to `top` (where all of the call's water has met) as reached this call; false
   * where the elevations differ (every anchor but the source, and the chain above it).
   */
  const touch = (from: number, top: number): boolean => {
    for (let v = from; v >= 0 && stamp[v] !== epoch; v = upAnchor[v]!) {
      stamp[v] = epoch;
      P[v] = 0;
      Q[v] = 0;
      R[v] = 0;
      touchedRanks[touched++] = rank[v]!;
      if (v !== sk.source && (!atLevel(anchorZ[v]!) || !atLevel(chainZ[upChain[v]!]!))) return false;
      if (v === top) break;
    }
    return true;
  };
  /** The anchor below a head where the walk takes its water up: its own, or the lower end of its chain. */
  const startOf = (e: Emitter) => {
    const anchor = sk.anchorOf[e.node]!;
    if (anchor >= 0) return anchor;
    const c = sk.chainOf[e.node]!;
    const chain = sk.chains[c]!;
    return upChain[chain.a] === c ? chain.a : chain.b;
  };
  /** An anchor's pressure with the resistance still pending on its flow. */
  const pressureAt = (v: number) => P[v]! + (R[v]! > 0 ? R[v]! * pow(Q[v]!, HW_EXPONENT) : 0);
  /** Resistance of chain `c` between interior positions x and y (0 and length + 1 are its ends). */
  const resistance = (c: number, x: number, y: number) => Math.abs(sk.chains[c]!.cumR[y]! - sk.chains[c]!.cumR[x]!);
  /** Where a head's water first enters an anchor: its own anchor, or the upper end of its chain. */
  const entryOf = (e: Emitter) => {
    const anchor = sk.anchorOf[e.node]!;
    if (anchor >= 0) return anchor;
    const c = sk.chainOf[e.node]!;
    const chain = sk.chains[c]!;
    return upAnchor[upChain[chain.a] === c ? chain.a : chain.b]!;
  };
  /**
   * The walk of the open heads `headIds` towards the source: the source's pressure and flow, or the anchor
   * `stopAt`'s once every head below it has arrived; `extra` joins at its anchor as one more input.
   */
  const walk = (headIds: string[], stopAt: number, extra: { anchor: number; pressure: number; flow: number } | null): Demand | null => {
    epoch++;
    touched = 0;
    levelSeen = false;
    headCount = 0;
    // Where all the water meets: above it, nothing joins, and the walk jumps to its end.
    let top = extra ? extra.anchor : -1;
    for (const id of headIds) {
      const e = emitterOf.get(id);
      if (!e) return null;
      heads[headCount++] = e;
      top = top < 0 ? startOf(e) : lift.meet(top, startOf(e));
    }
    if (top < 0) return null;
    if (top !== sk.source && !atLevel(pathLevel[upAnchor[top]!]!)) return null;
    if (extra && !touch(extra.anchor, top)) return null;
    for (let h = 0; h < headCount; h++) {
      const e = heads[h]!;
      const anchor = sk.anchorOf[e.node]!;
      if (anchor >= 0) {
        if (!touch(anchor, top)) return null;
        continue;
      }
      const c = sk.chainOf[e.node]!;
      const indices = chainHeadIndex[c]!;
      const emitters = chainHeadEmitter[c]!;
      if (chainStamp[c] !== epoch) {
        chainStamp[c] = epoch;
        chainHeadCount[c] = 0;
      }
      // Kept in order along the chain (a few heads: an insertion, no sort).
      const index = sk.indexInChain[e.node]!;
      let k = chainHeadCount[c]!++;
      for (; k > 0 && indices[k - 1]! > index; k--) {
        indices[k] = indices[k - 1]!;
        emitters[k] = emitters[k - 1]!;
      }
      indices[k] = index;
      emitters[k] = e;
      // The chain's lower end: the anchor whose way to the source runs through it.
      if (!touch(startOf(e), top)) return null;
    }
    for (let h = 0; h < headCount; h++) {
      const e = heads[h]!;
      const anchor = sk.anchorOf[e.node]!;
      if (anchor < 0) continue;
      scratch[0] = P[anchor]!;
      scratch[1] = Q[anchor]!;
      join(e.required, e.k * Math.sqrt(e.required));
      P[anchor] = scratch[0]!;
      Q[anchor] = scratch[1]!;
    }
    // Deepest first: in breadth-first order from the source, read backwards (typed sort, in place).
    touchedRanks.subarray(0, touched).sort();
    for (let x = touched - 1; x >= 0; x--) {
      const v = order[touchedRanks[x]!]!;
      if (extra && v === extra.anchor) {
        // Every input from below has arrived: the extra one joins.
        scratch[0] = Q[v]! > 0 ? pressureAt(v) : 0;
        scratch[1] = Q[v]!;
        join(extra.pressure, extra.flow);
        P[v] = scratch[0]!;
        Q[v] = scratch[1]!;
        R[v] = 0;
      }
      if (v === stopAt) return { pressure: pressureAt(v), flow: Q[v]! };
      const u = upAnchor[v]!;
      if (u < 0) return { pressure: pressureAt(v), flow: Q[v]! };
      // Up the chain from v to u, joining its open heads on the way.
      const c = upChain[v]!;
      const chain = sk.chains[c]!;
      const fromA = chain.a === v;
      const end = fromA ? chain.nodes.length + 1 : 0;
      const rise = PSI_PER_FT * (z(sk.anchorNode[v]!) - z(sk.anchorNode[u]!));
      let p: number;
      let q: number;
      let r: number;
      if (chainStamp[c] === epoch) {
        let pos = fromA ? 0 : chain.nodes.length + 1;
        scratch[0] = Q[v]! > 0 ? pressureAt(v) : 0;
        scratch[1] = Q[v]!;
        const indices = chainHeadIndex[c]!;
        const emitters = chainHeadEmitter[c]!;
        const count = chainHeadCount[c]!;
        for (let h = 0; h < count; h++) {
          const k = fromA ? h : count - 1 - h;
          const e = emitters[k]!;
          if (scratch[1]! > 0) scratch[0] = scratch[0]! + resistance(c, pos, indices[k]! + 1) * pow(scratch[1]!, HW_EXPONENT);
          join(e.required, e.k * Math.sqrt(e.required));
          pos = indices[k]! + 1;
        }
        p = scratch[0]! + rise;
        q = scratch[1]!;
        r = resistance(c, pos, end);
      } else {
        p = P[v]! + rise;
        q = Q[v]!;
        r = R[v]! + resistance(c, fromA ? 0 : chain.nodes.length + 1, end);
      }
      if (v === top) {
        // All the water is in: on to the end (the source, or `stopAt` above) with the way's sums.
        if (q === 0) return { pressure: 0, flow: 0 };
        const end = stopAt >= 0 ? stopAt : sk.source;
        const rest = r + pathR[u]! - pathR[end]!;
        return { pressure: p + rest * pow(q, HW_EXPONENT) + PSI_PER_FT * (z(sk.anchorNode[u]!) - z(sk.anchorNode[end]!)), flow: q };
      }
      if (q === 0) continue;
      if (Q[u] === 0) {
        P[u] = p;
        Q[u] = q;
        R[u] = r;
        continue;
      }
      scratch[0] = pressureAt(u);
      scratch[1] = Q[u]!;
      join(p + r * pow(q, HW_EXPONENT), q);
      P[u] = scratch[0]!;
      Q[u] = scratch[1]!;
      R[u] = 0;
    }
    return null;
  };
  const meet = lift.meet;
  /**
   * What a line's runs share in every group: where its water meets other water (`top`), the anchors and chains
   * its water passes below that (marked), and each run's pressure and flow at `top`, by size and first head.
   */
  interface LineWater {
    top: number;
    /** The anchors and chains its water passes below `top` (a few: sets, not arrays over the whole skeleton). */
    belowAnchor: Set<number>;
    belowChain: Set<number>;
    runs: Map<number, (Demand | null)[]>;
  }
  const lines = new WeakMap<readonly string[], LineWater | null>();
  const lineWater = (line: readonly string[]): LineWater | null => {
    if (lines.has(line)) return lines.get(line)!;
    const emitters = line.map((id) => emitterOf.get(id));
    let water: LineWater | null = null;
    if (emitters.every((e) => e !== undefined)) {
      const top = (emitters as Emitter[]).map(entryOf).reduce(meet);
      const belowAnchor = new Set<number>();
      const belowChain = new Set<number>();
      for (const e of emitters as Emitter[]) {
        let v = sk.anchorOf[e.node]!;
        if (v < 0) {
          belowChain.add(sk.chainOf[e.node]!);
          v = entryOf(e);
        }
        for (; v !== top && v >= 0 && !belowAnchor.has(v); v = upAnchor[v]!) {
          belowAnchor.add(v);
          if (upChain[v]! >= 0) belowChain.add(upChain[v]!);
        }
      }
      water = { top, belowAnchor, belowChain, runs: new Map() };
    }
    lines.set(line, water);
    return water;
  };
  /** Whether a base head's water meets the line's below its `top` (then the runs cannot be summed up there). */
  const meetsBelow = (e: Emitter, w: LineWater) => {
    const onChain = sk.anchorOf[e.node]! < 0;
    if (onChain && w.belowChain.has(sk.chainOf[e.node]!)) return true;
    for (let v = onChain ? entryOf(e) : sk.anchorOf[e.node]!; v >= 0 && depth[v]! > depth[w.top]!; v = upAnchor[v]!) {
      if (w.belowAnchor.has(v) || (upChain[v]! >= 0 && w.belowChain.has(upChain[v]!))) return true;
    }
    return false;
  };
  return {
    bound: (headIds) => walk(headIds, -1, null),
    boundAlong(base, line, first, last, size) {
      if (first >= last) return walk([...base, ...line.slice(first, first + size)], -1, null);
      const w = lineWater(line);
      const union = () => walk([...base, ...line.slice(first, last + size)], -1, null);
      if (!w) return null;
      for (const id of base) {
        const e = emitterOf.get(id);
        if (!e) return null;
        if (meetsBelow(e, w)) return union();
      }
      let each = w.runs.get(size);
      if (!each) w.runs.set(size, (each = new Array<Demand | null>(line.length)));
      let pressure = 0;
      for (let k = first; k <= last; k++) {
        // A run's sum at `top` is the same in every group it is a placement of.
        let d = each[k];
        if (d === undefined) each[k] = d = walk(line.slice(k, k + size), w.top, null);
        if (!d) return null;
        pressure = Math.max(pressure, d.pressure);
      }
      let flow = 0;
      for (let k = first; k <= last; k++) flow = Math.max(flow, each[k]!.flow * pow(pressure / each[k]!.pressure, raiseExponent));
      return walk(base, -1, { anchor: w.top, pressure, flow });
    },
  };
}

/**
 * The model cut to a breadth-first spanning tree from the source (loops opened). Not a bound on the looped
 * system's demand, but a good estimate of which areas are demanding, used to order a search.
 */
export function spanningTreeModel(model: HydraulicModel): HydraulicModel {
  const { parentPipe } = breadthFirst(model);
  return {
    ...model,
    pipes: [...parentPipe]
      .filter((k) => k >= 0)
      .sort((a, b) => a - b)
      .map((k) => model.pipes[k]!),
  };
}

/** Breadth-first from the source: visiting order, and each reached node's pipe and node towards the source. */
function breadthFirst(model: HydraulicModel): { order: number[]; parentPipe: Int32Array; parentNode: Int32Array } {
  const n = model.nodes.length;
  const parentPipe = new Int32Array(n).fill(-1);
  const parentNode = new Int32Array(n).fill(-1);
  const incident: number[][] = model.nodes.map(() => []);
  model.pipes.forEach((p, k) => {
    incident[p.from]!.push(k);
    incident[p.to]!.push(k);
  });
  const seen = new Uint8Array(n);
  const order = [model.source];
  seen[model.source] = 1;
  for (let i = 0; i < order.length; i++) {
    const u = order[i]!;
    for (const k of incident[u]!) {
      const p = model.pipes[k]!;
      const v = p.from === u ? p.to : p.from;
      if (seen[v]) continue;
      seen[v] = 1;
      parentPipe[v] = k;
      parentNode[v] = u;
      order.push(v);
    }
  }
  return { order, parentPipe, parentNode };
}

/** Joins two anchor levels (see `kFactorWalk`): null says nothing, NaN is mixed, else one level within 1e-9 ft. */
function sameLevel(a: number | null, b: number | null): number | null {
  if (a === null) return b;
  if (b === null) return a;
  return Math.abs(a - b) <= 1e-9 ? a : Number.NaN;
}

/** Ancestors by powers of two (binary lifting): the meeting anchor of two in O(log depth). */
function ancestorTable(up: Int32Array, depth: Int32Array, order: readonly number[]) {
  const n = up.length;
  const levels = Math.max(1, Math.ceil(Math.log2(n + 1)));
  const table = new Int32Array(levels * n);
  for (const v of order) table[v] = up[v]! < 0 ? v : up[v]!;
  for (let k = 1; k < levels; k++) for (let v = 0; v < n; v++) table[k * n + v] = table[(k - 1) * n + table[(k - 1) * n + v]!]!;
  return {
    meet(a: number, b: number): number {
      if (depth[a]! < depth[b]!) [a, b] = [b, a];
      for (let k = levels - 1; k >= 0; k--) if (depth[a]! - (1 << k) >= depth[b]!) a = table[k * n + a]!;
      if (a === b) return a;
      for (let k = levels - 1; k >= 0; k--) {
        const x = table[k * n + a]!;
        const y = table[k * n + b]!;
        if (x !== y) {
          a = x;
          b = y;
        }
      }
      return table[a]!;
    },
  };
}
