// A safe upper bound on a candidate area's demand, for pruning the search on tree systems. Each head flows
// at most K·√(P − static head), so the source pressure P satisfies P ≤ F(P), F sublinear: P ≤ fixed point.

import { HW_EXPONENT, PSI_PER_FT } from '../hydraulics/hazen-williams.js';
import type { HydraulicModel } from '../hydraulics/model.js';

export interface TreeBound {
  /** Upper bounds on the required source pressure (psi) and on the source flow (gpm) of the heads given. */
  bound(headIds: string[]): { pressure: number; flow: number };
}

/** Builds the bound over a model in which every head may flow; null unless the model is a tree. */
export function treeBound(model: HydraulicModel): TreeBound | null {
  if (model.pipes.length !== model.nodes.length - 1) return null;
  const parentPipe = new Int32Array(model.nodes.length).fill(-1);
  const parentNode = new Int32Array(model.nodes.length).fill(-1);
  const incident: number[][] = model.nodes.map(() => []);
  model.pipes.forEach((p, k) => { incident[p.from]!.push(k); incident[p.to]!.push(k); });
  const seen = new Uint8Array(model.nodes.length);
  const queue = [model.source];
  seen[model.source] = 1;
  for (let i = 0; i < queue.length; i++) {
    const u = queue[i]!;
    for (const k of incident[u]!) {
      const p = model.pipes[k]!;
      const v = p.from === u ? p.to : p.from;
      if (seen[v]) continue;
      seen[v] = 1; parentPipe[v] = k; parentNode[v] = u; queue.push(v);
    }
  }
  if (queue.length !== model.nodes.length) return null;
  const zs = model.nodes[model.source]!.elevation;
  const emitterOf = new Map(model.emitters.map((e) => [e.headId, e]));
  return {
    bound(headIds) {
      const ems = headIds.map((id) => emitterOf.get(id)!).filter(Boolean);
      const lift = ems.map((e) => PSI_PER_FT * (model.nodes[e.node]!.elevation - zs));
      const F = (X: number) => {
        const flowIn = new Map<number, number>();
        ems.forEach((e, i) => {
          const q = e.k * Math.sqrt(Math.max(0, X - lift[i]!));
          for (let n = e.node; parentPipe[n]! >= 0; n = parentNode[n]!) flowIn.set(parentPipe[n]!, (flowIn.get(parentPipe[n]!) ?? 0) + q);
        });
        let worst = 0;
        ems.forEach((e, i) => {
          let loss = 0;
          for (let n = e.node; parentPipe[n]! >= 0; n = parentNode[n]!) loss += model.pipes[parentPipe[n]!]!.r * flowIn.get(parentPipe[n]!)! ** HW_EXPONENT;
          worst = Math.max(worst, e.required + lift[i]! + loss);
        });
        return worst;
      };
      // X ≤ F(X) holds at the true pressure; F grows like X^0.925, so X − F(X) changes sign once: bisect.
      let lo = Math.max(...ems.map((e, i) => e.required + lift[i]!));
      let hi = Math.max(lo * 2, 1);
      while (F(hi) > hi) hi *= 2;
      for (let it = 0; it < 60 && hi - lo > 1e-9 * hi; it++) {
        const mid = (lo + hi) / 2;
        if (F(mid) > mid) lo = mid; else hi = mid;
      }
      const flow = ems.reduce((s, e, i) => s + e.k * Math.sqrt(Math.max(0, hi - lift[i]!)), 0);
      return { pressure: hi, flow };
    },
  };
}
