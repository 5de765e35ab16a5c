// The K-factor balancing walk on tree systems, from the heads to the source: with exponent ½ the classic hand
// method; with 1/1.85 a safe upper bound on the demand, which prunes the design-area search.

import { HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import { pipesAtNodes, type Emitter, type HydraulicModel } from './model.js';
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
  /**
   * The bound of `boundAlong` (of `bound` where `next` is null) for a group whose `base` is whole windows of lines
   * made known by `knowLines`, each a row of a line's heads: each window's water is summed where its line's water
   * meets other water, once for every group that holds the window, and enters the walk there as one input. The
   * same bound to rounding; the plain walk where a head's line is unknown or its water meets another line's below.
   */
  boundOfGroup(base: string[], next: { heads: readonly string[]; first: number; last: number; size: number } | null): Demand | null;
  /** Lines whose windows `boundOfGroup` may sum once: each the heads of a line in order, the same array every call. */
  knowLines(lines: Iterable<readonly string[]>): void;
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
  if (model.pipes.length !== model.nodes.length - 1) return null;
  const sk = skeleton ?? buildSkeleton(model);
  const tree = orient(sk);
  return tree ? new KFactorWalk(model, raiseExponent, sk, tree) : null;
}

/** The skeleton oriented from the source: each anchor's chain and anchor towards it, and the breadth-first order. */
interface Oriented {
  upChain: Int32Array;
  upAnchor: Int32Array;
  /** Each anchor's place in `order`. */
  rank: Int32Array;
  order: number[];
}

function orient(sk: Skeleton): Oriented | null {
  const nA = sk.anchorNode.length;
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
  return order.length === nA ? { upChain, upAnchor, rank, order } : null;
}

/**
 * What a line's runs share in every group: where its water meets other water (`top`), the anchors and chains
 * its water passes below that (a few: sets, not arrays over the whole skeleton), and each run's pressure and flow
 * at `top`, by size and first head.
 */
interface LineWater {
  top: number;
  belowAnchor: Set<number>;
  belowChain: Set<number>;
  runs: Map<number, Runs>;
  /** Each window's pressure and flow at `top`, by `from · (length + 1) + to`. */
  windows: Map<number, Demand | null>;
}

/**
 * The runs of one size along a line, by first head, as summed at the line's top once `summed`: each one's pressure
 * (Infinity: no bound holds) and its flow over the pressure's power, q / p^e: at a pressure P above p the run draws
 * at most that times P^e.
 */
interface Runs {
  summed: Uint8Array;
  pressure: Float64Array;
  perPower: Float64Array;
}

/** An input joining at an anchor once every input from below has arrived (a line's summed runs, or a window's water). */
interface Extra {
  anchor: number;
  pressure: number;
  flow: number;
}

/** a^x for a > 0 (exp and log: twice as fast as the power operator in V8). */
const pow = (a: number, x: number) => Math.exp(x * Math.log(a));

const NO_EXTRAS: readonly Extra[] = [];

class KFactorWalk implements TreeBound {
  private readonly sk: Skeleton;
  private readonly upChain: Int32Array;
  private readonly upAnchor: Int32Array;
  private readonly rank: Int32Array;
  private readonly order: number[];
  /** Elevations: the bound holds where every node below the source is at one level (see BOUND_EXPONENT). */
  private readonly anchorZ: Float64Array;
  private readonly chainZ: (number | null)[];
  private readonly emitterOf: Map<string, Emitter>;
  /**
   * The way from each anchor to the source, summed once: its chains' resistance and the one level of its anchors
   * and chains (null: none; NaN: mixed). Past the anchor where all of an area's water has met, a walk jumps to
   * the source with these instead of touching each anchor of a long cross main on the way.
   */
  private readonly pathR: Float64Array;
  private readonly pathLevel: (number | null)[];
  private readonly depth: Int32Array;
  private readonly lift: ReturnType<typeof ancestorTable>;
  /**
   * Per-call scratch, reused: each anchor's combined (pressure, flow) and the call that last touched it; each
   * chain's open heads (interior index, emitter) and the call that gave them. A flow that passes anchors without
   * joining another keeps its pipes' resistance R pending: its pressure there is P + R·Q^1.85, one power
   * evaluated where it meets other water instead of one per pipe run.
   */
  private readonly P: Float64Array;
  private readonly Q: Float64Array;
  private readonly R: Float64Array;
  private readonly stamp: Int32Array;
  private readonly touchedRanks: Int32Array;
  private readonly chainStamp: Int32Array;
  /** A chain's open heads in order along it (parallel lists, reused: their lengths only grow). */
  private readonly chainHeadCount: Int32Array;
  private readonly chainHeadIndex: number[][];
  private readonly chainHeadEmitter: Emitter[][];
  private readonly heads: Emitter[] = [];
  private headCount = 0;
  private epoch = 0;
  private touched = 0;
  /** [0, 1]: the running join's pressure and flow; [2]: the one elevation of every node reached this call, once `levelSeen`. */
  private readonly scratch = new Float64Array(3);
  /** What the last climb reached its upper anchor with: [pressure, flow, resistance pending]. */
  private readonly climbed = new Float64Array(3);
  private levelSeen = false;
  private readonly lines = new WeakMap<readonly string[], LineWater | null>();
  /**
   * The known lines by number (and their numbers), their waters, whether each one's water meets another's (1), and
   * for each of their heads a slot (by id) that holds its line's number and its place on it.
   */
  private readonly knownLines: (readonly string[])[] = [];
  private readonly numberOfLine = new Map<readonly string[], number>();
  private knownWaters: (LineWater | null)[] = [];
  private linesMeet: Uint8Array = new Uint8Array(0);
  private readonly slotOfHead = new Map<string, number>();
  private slotLine: Int32Array = new Int32Array(0);
  private slotPlace: Int32Array = new Int32Array(0);

  constructor(
    private readonly model: HydraulicModel,
    private readonly raiseExponent: number,
    sk: Skeleton,
    tree: Oriented,
  ) {
    this.sk = sk;
    ({ upChain: this.upChain, upAnchor: this.upAnchor, rank: this.rank, order: this.order } = tree);
    const nA = sk.anchorNode.length;
    const nC = sk.chains.length;
    this.anchorZ = Float64Array.from(sk.anchorNode, (v) => this.z(v));
    this.chainZ = sk.chains.map((c) => {
      const zs = Array.from(c.nodes, (v) => this.z(v));
      return zs.length && maxOf(zs) - minOf(zs) > 1e-9 ? Number.NaN : (zs[0] ?? null);
    });
    this.emitterOf = new Map(model.emitters.map((e) => [e.headId, e]));
    this.pathR = new Float64Array(nA);
    this.pathLevel = new Array(nA).fill(null);
    this.depth = new Int32Array(nA);
    for (const v of this.order) {
      const u = this.upAnchor[v]!;
      if (u < 0) continue;
      const c = sk.chains[this.upChain[v]!]!;
      this.pathR[v] = this.pathR[u]! + c.cumR[c.pipes.length]!;
      this.pathLevel[v] = sameLevel(sameLevel(this.anchorZ[v]!, this.chainZ[this.upChain[v]!]!), this.pathLevel[u]!);
      this.depth[v] = this.depth[u]! + 1;
    }
    this.lift = ancestorTable(this.upAnchor, this.depth, this.order);
    this.P = new Float64Array(nA);
    this.Q = new Float64Array(nA);
    this.R = new Float64Array(nA);
    this.stamp = new Int32Array(nA);
    this.touchedRanks = new Int32Array(nA);
    this.chainStamp = new Int32Array(nC);
    this.chainHeadCount = new Int32Array(nC);
    this.chainHeadIndex = sk.chains.map(() => []);
    this.chainHeadEmitter = sk.chains.map(() => []);
  }

  bound(headIds: string[]): Demand | null {
    return this.walk(headIds, -1, NO_EXTRAS);
  }

  boundAlong(base: string[], line: readonly string[], first: number, last: number, size: number): Demand | null {
    if (first >= last) return this.walk([...base, ...line.slice(first, first + size)], -1, NO_EXTRAS);
    const w = this.lineWater(line);
    if (!w) return null;
    for (const id of base) {
      const e = this.emitterOf.get(id);
      if (!e) return null;
      if (this.meetsBelow(e, w)) return this.walk([...base, ...line.slice(first, last + size)], -1, NO_EXTRAS);
    }
    const runs = this.runsAt(line, w, first, last, size);
    return runs && this.walk(base, -1, [runs]);
  }

  boundOfGroup(base: string[], next: { heads: readonly string[]; first: number; last: number; size: number } | null): Demand | null {
    const plain = () => (next ? this.boundAlong(base, next.heads, next.first, next.last, next.size) : this.bound(base));
    const windows = this.windowsOf(base);
    const nextLine = next ? this.numberOfLine.get(next.heads) : undefined;
    if (!windows || (next && nextLine === undefined)) return plain();
    const extras: Extra[] = [];
    for (let k = 0; k < windows.length; k += 3) {
      const number = windows[k]!;
      if (this.linesMeet[number]) return plain();
      const line = this.knownLines[number]!;
      const w = this.knownWaters[number]!;
      const key = windows[k + 1]! * (line.length + 1) + windows[k + 2]!;
      let d = w.windows.get(key);
      if (d === undefined) w.windows.set(key, (d = this.walk(line.slice(windows[k + 1]!, windows[k + 2]!), w.top, NO_EXTRAS)));
      if (!d) return null;
      extras.push({ anchor: w.top, pressure: d.pressure, flow: d.flow });
    }
    if (next) {
      if (this.linesMeet[nextLine!]) return plain();
      const runs = this.runsAt(next.heads, this.knownWaters[nextLine!]!, next.first, next.last, next.size);
      if (!runs) return null;
      extras.push(runs);
    }
    return this.walk([], -1, extras);
  }

  knowLines(lines: Iterable<readonly string[]>): void {
    for (const line of lines) this.knownLines.push(line);
    const slots = this.knownLines.reduce((n, line) => n + line.length, 0);
    this.slotLine = new Int32Array(slots);
    this.slotPlace = new Int32Array(slots);
    this.slotOfHead.clear();
    let slot = 0;
    this.knownLines.forEach((line, number) => {
      this.numberOfLine.set(line, number);
      line.forEach((id, place) => {
        this.slotOfHead.set(id, slot);
        this.slotLine[slot] = number;
        this.slotPlace[slot++] = place;
      });
    });
    this.knownWaters = this.knownLines.map((line) => this.lineWater(line));
    this.linesMeet = this.meetingLines();
  }

  /**
   * The runs of `size` heads of a line starting at `first` … `last`, summed at its top as one input: at least the
   * pressure of each, and at any higher pressure P at least the flow of each, q·(P/p)^e = P^e · q/p^e (null: no bound).
   */
  private runsAt(line: readonly string[], w: LineWater, first: number, last: number, size: number): Extra | null {
    let runs = w.runs.get(size);
    if (!runs) {
      runs = { summed: new Uint8Array(line.length), pressure: new Float64Array(line.length), perPower: new Float64Array(line.length) };
      w.runs.set(size, runs);
    }
    let pressure = 0;
    let perPower = 0;
    for (let k = first; k <= last; k++) {
      // A run's sum at `top` is the same in every group it is a placement of.
      if (!runs.summed[k]) {
        const d = this.walk(line.slice(k, k + size), w.top, NO_EXTRAS);
        runs.summed[k] = 1;
        runs.pressure[k] = d ? d.pressure : Number.POSITIVE_INFINITY;
        runs.perPower[k] = d && d.flow > 0 ? d.flow / pow(d.pressure, this.raiseExponent) : 0;
      }
      if (runs.pressure[k] === Number.POSITIVE_INFINITY) return null;
      pressure = Math.max(pressure, runs.pressure[k]!);
      perPower = Math.max(perPower, runs.perPower[k]!);
    }
    return { anchor: w.top, pressure, flow: perPower * pow(pressure, this.raiseExponent) };
  }

  /** A base's windows on known lines in its order, as (line number, from, to) triples; null where a head is on none. */
  private windowsOf(base: readonly string[]): number[] | null {
    const out: number[] = [];
    for (const id of base) {
      const slot = this.slotOfHead.get(id);
      if (slot === undefined) return null;
      const number = this.slotLine[slot]!;
      const place = this.slotPlace[slot]!;
      const n = out.length;
      if (n && out[n - 3] === number && out[n - 1] === place) out[n - 1]++;
      else out.push(number, place, place + 1);
    }
    return out;
  }

  /**
   * The known lines whose water meets another known line's below that one's top, or that hold an unknown head:
   * each line's anchors and chains below its top are its own, and a line whose heads' way up, or whose way on from
   * its top, passes what is another's meets that one (1). Every other line's windows may be summed at its top alone.
   */
  private meetingLines(): Uint8Array {
    const anchorOwner = new Int32Array(this.sk.anchorNode.length).fill(-1);
    const chainOwner = new Int32Array(this.sk.chains.length).fill(-1);
    const meet = new Uint8Array(this.knownLines.length);
    const claim = (owner: Int32Array, at: number, line: number) => {
      if (owner[at] === -1) owner[at] = line;
      else if (owner[at] !== line) meet[line] = meet[owner[at]!] = 1;
    };
    this.knownWaters.forEach((w, line) => {
      if (!w) {
        meet[line] = 1;
        return;
      }
      for (const a of w.belowAnchor) claim(anchorOwner, a, line);
      for (const c of w.belowChain) claim(chainOwner, c, line);
    });
    // Whether the way from an anchor to the source passes what a line owns (from the source down: one pass).
    const ownedAbove = new Uint8Array(this.sk.anchorNode.length);
    const ownedAt = (v: number) => anchorOwner[v]! >= 0 || (this.upChain[v]! >= 0 && chainOwner[this.upChain[v]!]! >= 0);
    for (const v of this.order) ownedAbove[v] = ownedAt(v) || (this.upAnchor[v]! >= 0 && ownedAbove[this.upAnchor[v]!] === 1) ? 1 : 0;
    // A line owns nothing above its top: whatever its way on passes is another's (those few are walked).
    this.knownWaters.forEach((w, line) => {
      if (!w || !ownedAbove[w.top]) return;
      meet[line] = 1;
      for (let v = w.top; v >= 0; v = this.upAnchor[v]!) {
        if (anchorOwner[v]! >= 0) meet[anchorOwner[v]!] = 1;
        if (this.upChain[v]! >= 0 && chainOwner[this.upChain[v]!]! >= 0) meet[chainOwner[this.upChain[v]!]!] = 1;
      }
    });
    return meet;
  }

  private z(node: number): number {
    return this.model.nodes[node]!.elevation;
  }

  /** Adds an input (p, q) to the running join (scratch[0], scratch[1]): the higher pressure wins, the other side's flow is raised to it. */
  private join(p: number, q: number): void {
    const s = this.scratch;
    const jp = s[0]!;
    const jq = s[1]!;
    if (jq === 0) {
      s[0] = p;
      s[1] = q;
    } else if (p <= jp) s[1] = jq + q * pow(jp / p, this.raiseExponent);
    else {
      s[1] = jq * pow(p / jp, this.raiseExponent) + q;
      s[0] = p;
    }
  }

  /** Whether a level (null: none) is the one level of this call's nodes. */
  private atLevel(h: number | null): boolean {
    if (h === null) return true;
    if (Number.isNaN(h)) return false;
    if (!this.levelSeen) {
      this.scratch[2] = h;
      this.levelSeen = true;
    }
    return Math.abs(h - this.scratch[2]!) <= 1e-9;
  }

  /**
   * Marks the anchors from `from` up to `top` (where all of the call's water has met) as reached this call; false
   * where the elevations differ (every anchor but the source, and the chain above it).
   */
  private touch(from: number, top: number): boolean {
    const { upAnchor, upChain, sk } = this;
    for (let v = from; v >= 0 && this.stamp[v] !== this.epoch; v = upAnchor[v]!) {
      this.stamp[v] = this.epoch;
      this.P[v] = 0;
      this.Q[v] = 0;
      this.R[v] = 0;
      this.touchedRanks[this.touched++] = this.rank[v]!;
      if (v !== sk.source && (!this.atLevel(this.anchorZ[v]!) || !this.atLevel(this.chainZ[upChain[v]!]!))) return false;
      if (v === top) break;
    }
    return true;
  }

  /** An anchor's pressure with the resistance still pending on its flow. */
  private pressureAt(v: number): number {
    return this.P[v]! + (this.R[v]! > 0 ? this.R[v]! * pow(this.Q[v]!, HW_EXPONENT) : 0);
  }

  /** Resistance of chain `c` between interior positions x and y (0 and length + 1 are its ends). */
  private resistance(c: number, x: number, y: number): number {
    const cumR = this.sk.chains[c]!.cumR;
    return Math.abs(cumR[y]! - cumR[x]!);
  }

  /** The anchor below a head where the walk takes its water up: its own, or the lower end of its chain. */
  private startOf(e: Emitter): number {
    const anchor = this.sk.anchorOf[e.node]!;
    if (anchor >= 0) return anchor;
    const c = this.sk.chainOf[e.node]!;
    const chain = this.sk.chains[c]!;
    return this.upChain[chain.a] === c ? chain.a : chain.b;
  }

  /** Where a head's water first enters an anchor: its own anchor, or the upper end of its chain. */
  private entryOf(e: Emitter): number {
    const anchor = this.sk.anchorOf[e.node]!;
    return anchor >= 0 ? anchor : this.upAnchor[this.startOf(e)]!;
  }

  /**
   * The walk of the open heads `headIds` towards the source: the source's pressure and flow, or the anchor
   * `stopAt`'s once every head below it has arrived; each of `extras` joins at its anchor as one more input.
   */
  private walk(headIds: string[], stopAt: number, extras: readonly Extra[]): Demand | null {
    const top = this.gather(headIds, extras);
    if (top < 0) return null;
    this.joinAnchorHeads();
    const { P, Q, R, order, upAnchor, sk } = this;
    // Deepest first: in breadth-first order from the source, read backwards (typed sort, in place).
    this.touchedRanks.subarray(0, this.touched).sort();
    for (let x = this.touched - 1; x >= 0; x--) {
      const v = order[this.touchedRanks[x]!]!;
      for (const extra of extras) {
        if (v !== extra.anchor) continue;
        // Every input from below has arrived: the extra one joins.
        this.scratch[0] = Q[v]! > 0 ? this.pressureAt(v) : 0;
        this.scratch[1] = Q[v]!;
        this.join(extra.pressure, extra.flow);
        P[v] = this.scratch[0]!;
        Q[v] = this.scratch[1]!;
        R[v] = 0;
      }
      const u = upAnchor[v]!;
      if (v === stopAt || u < 0) return { pressure: this.pressureAt(v), flow: Q[v]! };
      this.climb(v, u);
      const p = this.climbed[0]!;
      const q = this.climbed[1]!;
      const r = this.climbed[2]!;
      if (v === top) {
        // All the water is in: on to the end (the source, or `stopAt` above) with the way's sums.
        if (q === 0) return { pressure: 0, flow: 0 };
        const end = stopAt >= 0 ? stopAt : sk.source;
        const rest = r + this.pathR[u]! - this.pathR[end]!;
        return {
          pressure: p + rest * pow(q, HW_EXPONENT) + PSI_PER_FT * (this.z(sk.anchorNode[u]!) - this.z(sk.anchorNode[end]!)),
          flow: q,
        };
      }
      if (q === 0) continue;
      if (Q[u] === 0) {
        P[u] = p;
        Q[u] = q;
        R[u] = r;
        continue;
      }
      this.scratch[0] = this.pressureAt(u);
      this.scratch[1] = Q[u]!;
      this.join(p + r * pow(q, HW_EXPONENT), q);
      P[u] = this.scratch[0]!;
      Q[u] = this.scratch[1]!;
      R[u] = 0;
    }
    return null;
  }

  /**
   * A new call: its heads listed, those on chains in order along their chain, and the anchors from theirs up to
   * where all the water meets touched; that meeting anchor, or −1 where no bound holds (an unknown head, no head,
   * mixed elevations).
   */
  private gather(headIds: string[], extras: readonly Extra[]): number {
    this.epoch++;
    this.touched = 0;
    this.levelSeen = false;
    this.headCount = 0;
    let top = -1;
    for (const extra of extras) top = top < 0 ? extra.anchor : this.lift.meet(top, extra.anchor);
    for (const id of headIds) {
      const e = this.emitterOf.get(id);
      if (!e) return -1;
      this.heads[this.headCount++] = e;
      top = top < 0 ? this.startOf(e) : this.lift.meet(top, this.startOf(e));
    }
    if (top < 0) return -1;
    if (top !== this.sk.source && !this.atLevel(this.pathLevel[this.upAnchor[top]!]!)) return -1;
    for (const extra of extras) if (!this.touch(extra.anchor, top)) return -1;
    for (let h = 0; h < this.headCount; h++) {
      const e = this.heads[h]!;
      if (this.sk.anchorOf[e.node]! < 0) this.placeOnChain(e);
      if (!this.touch(this.startOf(e), top)) return -1;
    }
    return top;
  }

  /** Lists a head among its chain's open heads this call, kept in order along the chain (a few: insertion). */
  private placeOnChain(e: Emitter): void {
    const c = this.sk.chainOf[e.node]!;
    const indices = this.chainHeadIndex[c]!;
    const emitters = this.chainHeadEmitter[c]!;
    if (this.chainStamp[c] !== this.epoch) {
      this.chainStamp[c] = this.epoch;
      this.chainHeadCount[c] = 0;
    }
    const index = this.sk.indexInChain[e.node]!;
    let k = this.chainHeadCount[c]!++;
    for (; k > 0 && indices[k - 1]! > index; k--) {
      indices[k] = indices[k - 1]!;
      emitters[k] = emitters[k - 1]!;
    }
    indices[k] = index;
    emitters[k] = e;
  }

  /** Heads on anchors join there, each asking its required pressure and drawing K·√p. */
  private joinAnchorHeads(): void {
    for (let h = 0; h < this.headCount; h++) {
      const e = this.heads[h]!;
      const anchor = this.sk.anchorOf[e.node]!;
      if (anchor < 0) continue;
      this.scratch[0] = this.P[anchor]!;
      this.scratch[1] = this.Q[anchor]!;
      this.join(e.required, e.k * Math.sqrt(e.required));
      this.P[anchor] = this.scratch[0]!;
      this.Q[anchor] = this.scratch[1]!;
    }
  }

  /** Up the chain from anchor v to u, joining its open heads on the way: the pressure and flow at u, and the resistance pending (in `climbed`). */
  private climb(v: number, u: number): void {
    const { sk, P, Q, R } = this;
    const c = this.upChain[v]!;
    const chain = sk.chains[c]!;
    const fromA = chain.a === v;
    const end = fromA ? chain.nodes.length + 1 : 0;
    const rise = PSI_PER_FT * (this.z(sk.anchorNode[v]!) - this.z(sk.anchorNode[u]!));
    if (this.chainStamp[c] !== this.epoch) {
      this.reach(P[v]! + rise, Q[v]!, R[v]! + this.resistance(c, fromA ? 0 : chain.nodes.length + 1, end));
      return;
    }
    let pos = fromA ? 0 : chain.nodes.length + 1;
    this.scratch[0] = Q[v]! > 0 ? this.pressureAt(v) : 0;
    this.scratch[1] = Q[v]!;
    const indices = this.chainHeadIndex[c]!;
    const emitters = this.chainHeadEmitter[c]!;
    const count = this.chainHeadCount[c]!;
    for (let h = 0; h < count; h++) {
      const k = fromA ? h : count - 1 - h;
      const e = emitters[k]!;
      if (this.scratch[1]! > 0)
        this.scratch[0] = this.scratch[0]! + this.resistance(c, pos, indices[k]! + 1) * pow(this.scratch[1]!, HW_EXPONENT);
      this.join(e.required, e.k * Math.sqrt(e.required));
      pos = indices[k]! + 1;
    }
    this.reach(this.scratch[0]! + rise, this.scratch[1]!, this.resistance(c, pos, end));
  }

  /** Notes what a climb reaches its upper anchor with: pressure, flow, and the resistance still pending on that flow. */
  private reach(p: number, q: number, r: number): void {
    this.climbed[0] = p;
    this.climbed[1] = q;
    this.climbed[2] = r;
  }

  /** What a line's runs share (cached per line array), or null where one of its heads is unknown. */
  private lineWater(line: readonly string[]): LineWater | null {
    if (this.lines.has(line)) return this.lines.get(line)!;
    const emitters = line.map((id) => this.emitterOf.get(id));
    let water: LineWater | null = null;
    if (emitters.every((e) => e !== undefined)) {
      const top = (emitters as Emitter[]).map((e) => this.entryOf(e)).reduce((a, b) => this.lift.meet(a, b));
      const belowAnchor = new Set<number>();
      const belowChain = new Set<number>();
      for (const e of emitters as Emitter[]) {
        let v = this.sk.anchorOf[e.node]!;
        if (v < 0) {
          belowChain.add(this.sk.chainOf[e.node]!);
          v = this.entryOf(e);
        }
        for (; v !== top && v >= 0 && !belowAnchor.has(v); v = this.upAnchor[v]!) {
          belowAnchor.add(v);
          if (this.upChain[v]! >= 0) belowChain.add(this.upChain[v]!);
        }
      }
      water = { top, belowAnchor, belowChain, runs: new Map(), windows: new Map() };
    }
    this.lines.set(line, water);
    return water;
  }

  /** Whether a base head's water meets the line's below its `top` (then the runs cannot be summed up there). */
  private meetsBelow(e: Emitter, w: LineWater): boolean {
    const { sk, depth, upAnchor, upChain } = this;
    const onChain = sk.anchorOf[e.node]! < 0;
    if (onChain && w.belowChain.has(sk.chainOf[e.node]!)) return true;
    for (let v = onChain ? this.entryOf(e) : sk.anchorOf[e.node]!; v >= 0 && depth[v]! > depth[w.top]!; v = upAnchor[v]!) {
      if (w.belowAnchor.has(v) || (upChain[v]! >= 0 && w.belowChain.has(upChain[v]!))) return true;
    }
    return false;
  }
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
  const incident = pipesAtNodes(model);
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
