// The K-factor balancing walk on tree systems, from the heads to the source: with exponent ½ the classic hand
// method; with 1/1.85 a safe upper bound on the demand, which prunes the design-area search.

import { HW_EXPONENT, PSI_PER_FT } from './hazen-williams.js';
import type { HydraulicModel } from './model.js';

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
  if (order.length !== n) return null;
  const rank = new Int32Array(n);
  order.forEach((v, i) => { rank[v] = i; });
  const emitterOf = new Map(model.emitters.map((e) => [e.headId, e]));
  const z = (v: number) => model.nodes[v]!.elevation;
  return {
    bound(headIds) {
      // Nodes on the paths from the candidate's heads to the source, deepest first.
      const own = new Map<number, { p: number; q: number }>();
      const active = new Set<number>();
      for (const id of headIds) {
        const e = emitterOf.get(id);
        if (!e) return null;
        own.set(e.node, { p: e.required, q: e.k * Math.sqrt(e.required) });
        for (let v = e.node; v >= 0 && !active.has(v); v = parentNode[v]!) active.add(v);
      }
      const level = z(headIds.length ? emitterOf.get(headIds[0]!)!.node : model.source);
      for (const v of active) if (v !== model.source && Math.abs(z(v) - level) > 1e-9) return null;
      const inputs = new Map<number, { p: number; q: number }[]>();
      const nodes = [...active].sort((a, b) => rank[b]! - rank[a]!);
      let top = { p: 0, q: 0 };
      for (const v of nodes) {
        const list = [...(inputs.get(v) ?? [])];
        const self = own.get(v);
        if (self) list.push(self);
        const p = Math.max(...list.map((x) => x.p));
        const q = list.reduce((s, x) => s + x.q * (p / x.p) ** raiseExponent, 0);
        top = { p, q };
        const up = parentNode[v]!;
        if (up < 0) break;
        const pipe = model.pipes[parentPipe[v]!]!;
        const atParent = p + pipe.r * q ** HW_EXPONENT + PSI_PER_FT * (z(v) - z(up));
        inputs.set(up, [...(inputs.get(up) ?? []), { p: atParent, q }]);
      }
      return { pressure: top.p, flow: top.q };
    },
  };
}

/**
 * The model cut to a breadth-first spanning tree from the source (loops opened). Not a bound on the looped
 * system's demand, but a good estimate of which areas are demanding, used to order a search.
 */
export function spanningTreeModel(model: HydraulicModel): HydraulicModel {
  const incident: number[][] = model.nodes.map(() => []);
  model.pipes.forEach((p, k) => { incident[p.from]!.push(k); incident[p.to]!.push(k); });
  const seen = new Uint8Array(model.nodes.length);
  const keep: number[] = [];
  const queue = [model.source];
  seen[model.source] = 1;
  for (let i = 0; i < queue.length; i++) {
    const u = queue[i]!;
    for (const k of incident[u]!) {
      const p = model.pipes[k]!;
      const v = p.from === u ? p.to : p.from;
      if (seen[v]) continue;
      seen[v] = 1;
      keep.push(k);
      queue.push(v);
    }
  }
  return { ...model, pipes: keep.map((k) => model.pipes[k]!) };
}
