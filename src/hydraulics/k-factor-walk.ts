// The K-factor balancing walk on tree systems, from the heads to the source: with exponent ½ the classic hand
// method; with 1/1.85 a safe upper bound on the demand, which prunes the design-area search.

import { HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import type { Emitter, HydraulicModel } from './model.js';

export interface TreeBound {
  /** Upper bounds on the required source pressure (psi) and the source flow (gpm), or null where none holds. */
  bound(headIds: string[]): { pressure: number; flow: number } | null;
}

/**
 * Why it is an upper bound: a subtree of pipes (loss ∝ Q^1.85) and heads (loss ∝ Q²) in series and parallel has
 * d ln Q / d ln p between 1/2 and 1/1.85, so raising its inlet pressure by s ≥ 1 raises its flow by at most s^(1/1.85).
 * The hand method's √s (exact for a lone head) becomes s^(1/1.85); by induction from the heads up, each node's
 * pressure is at least the least pressure that satisfies its heads, and its flow at least the true flow at that
 * pressure, so the source pressure and flow are bounded above. Static head between junctions would break the
 * elasticity argument, so the bound is given only where every node below the source is at one elevation.
 */
export const BOUND_EXPONENT = 1 / HW_EXPONENT;
/** The classic hand method scales the lower side's flow by √(p_high/p_low) (shared/TRADE.md, confirmed). */
export const HAND_METHOD_EXPONENT = 0.5;

export const treeBound = (model: HydraulicModel): TreeBound | null => kFactorWalk(model, BOUND_EXPONENT);

/** The K-factor balancing walk over a tree model, raising lower-pressure sides by (p_high/p_low)^exponent. */
export function kFactorWalk(model: HydraulicModel, raiseExponent: number): TreeBound | null {
  const n = model.nodes.length;
  if (model.pipes.length !== n - 1) return null;
  const { order: walkOrder, parentPipe, parentNode } = breadthFirst(model);
  if (walkOrder.length !== n) return null;
  const rank = new Int32Array(n);
  walkOrder.forEach((v, i) => { rank[v] = i; });
  const emitterOf = new Map(model.emitters.map((e) => [e.headId, e]));
  const z = Float64Array.from(model.nodes, (node) => node.elevation);
  const rise = new Float64Array(n);
  for (let v = 0; v < n; v++) if (parentNode[v]! >= 0) rise[v] = PSI_PER_FT * (z[v]! - z[parentNode[v]!]!);
  const resistance = Float64Array.from({ length: n }, (_, v) => (parentPipe[v]! >= 0 ? model.pipes[parentPipe[v]!]!.r : 0));
  // Per-call scratch, reused: a node's combined (pressure, flow), the call that last touched it, and the
  // touched nodes' ranks in breadth-first order (children are joined into parents from the deepest up).
  const P = new Float64Array(n);
  const Q = new Float64Array(n);
  const stamp = new Int32Array(n);
  const ranks = new Int32Array(n);
  let epoch = 0;
  /** a^x for a > 0 (exp and log: twice as fast as the power operator in V8). */
  const pow = (a: number, x: number) => Math.exp(x * Math.log(a));
  /** Joins an input (p, q) into node u: the higher pressure wins, the other side's flow is raised to it. */
  const join = (u: number, p: number, q: number) => {
    if (Q[u] === 0) { P[u] = p; Q[u] = q; return; }
    if (p <= P[u]!) Q[u] = Q[u]! + q * pow(P[u]! / p, raiseExponent);
    else { Q[u] = Q[u]! * pow(p / P[u]!, raiseExponent) + q; P[u] = p; }
  };
  return {
    bound(headIds) {
      epoch++;
      let touched = 0;
      let level: number | null = null;
      const heads: Emitter[] = [];
      for (const id of headIds) {
        const e = emitterOf.get(id);
        if (!e) return null;
        heads.push(e);
        for (let v = e.node; v >= 0 && stamp[v] !== epoch; v = parentNode[v]!) {
          stamp[v] = epoch; P[v] = 0; Q[v] = 0; ranks[touched++] = rank[v]!;
          if (v !== model.source) {
            if (level === null) level = z[v]!;
            else if (Math.abs(z[v]! - level) > 1e-9) return null;
          }
        }
      }
      for (const e of heads) join(e.node, e.required, e.k * Math.sqrt(e.required));
      const order = ranks.subarray(0, touched).sort();
      for (let i = touched - 1; i >= 0; i--) {
        const v = walkOrder[order[i]!]!;
        const up = parentNode[v]!;
        if (up < 0) return { pressure: P[v]!, flow: Q[v]! };
        join(up, P[v]! + resistance[v]! * pow(Q[v]!, HW_EXPONENT) + rise[v]!, Q[v]!);
      }
      return null;
    },
  };
}

/**
 * The model cut to a breadth-first spanning tree from the source (loops opened). Not a bound on the looped
 * system's demand, but a good estimate of which areas are demanding, used to order a search.
 */
export function spanningTreeModel(model: HydraulicModel): HydraulicModel {
  const { parentPipe } = breadthFirst(model);
  return { ...model, pipes: [...parentPipe].filter((k) => k >= 0).sort((a, b) => a - b).map((k) => model.pipes[k]!) };
}

/** Breadth-first from the source: visiting order, and each reached node's pipe and node towards the source. */
function breadthFirst(model: HydraulicModel): { order: number[]; parentPipe: Int32Array; parentNode: Int32Array } {
  const n = model.nodes.length;
  const parentPipe = new Int32Array(n).fill(-1);
  const parentNode = new Int32Array(n).fill(-1);
  const incident: number[][] = model.nodes.map(() => []);
  model.pipes.forEach((p, k) => { incident[p.from]!.push(k); incident[p.to]!.push(k); });
  const seen = new Uint8Array(n);
  const order = [model.source];
  seen[model.source] = 1;
  for (let i = 0; i < order.length; i++) {
    const u = order[i]!;
    for (const k of incident[u]!) {
      const p = model.pipes[k]!;
      const v = p.from === u ? p.to : p.from;
      if (seen[v]) continue;
      seen[v] = 1; parentPipe[v] = k; parentNode[v] = u; order.push(v);
    }
  }
  return { order, parentPipe, parentNode };
}
