// Finds the hydraulically most demanding design area and the runner-up: every candidate is scored by a full
// hydraulic solve, in order of a safe upper bound, skipping those whose bound cannot beat the runner-up.

import type { Settings } from '../config/settings.js';
import { calculateArea, type AreaHydraulics } from '../hydraulics/calculate.js';
import { buildModel, type FlowingHead } from '../hydraulics/model.js';
import { availablePressure } from '../hydraulics/water-supply.js';
import type { Network } from '../network/types.js';
import type { Candidate } from './candidates.js';
import { treeBound } from '../hydraulics/k-factor-walk.js';

export interface ScoredArea {
  candidate: Candidate;
  hydraulics: AreaHydraulics;
  /** Demand score: the supply's shortfall (−margin) with a flow test, else the source pressure; higher is more demanding. */
  score: number;
}

export interface SearchOutcome {
  best: ScoredArea | null;
  runnerUp: ScoredArea | null;
  candidates: number;
  evaluated: number;
  solves: number;
  /** Whether the bound was available (tree systems). */
  pruned: boolean;
}

export function demandScore(h: AreaHydraulics): number {
  return h.margin === null ? h.sourcePressure : -h.margin;
}

export function searchMostDemanding(
  network: Network, candidates: Candidate[], flowingOf: (ids: string[]) => FlowingHead[], settings: Settings, hose: number,
  options: { prune?: boolean } = {},
): SearchOutcome {
  const all = flowingOf([...new Set(candidates.flatMap((c) => c.headIds))]);
  const bound = options.prune === false || all.length === 0 ? null : treeBound(buildModel(network, all, settings));
  const supply = settings.supply;
  const upper = candidates.map((c) => {
    if (!bound) return Infinity;
    const b = bound.bound(c.headIds);
    if (!b) return Infinity;
    return supply ? b.pressure - availablePressure(supply, b.flow + hose) : b.pressure;
  });
  const order = candidates.map((_, i) => i).sort((a, b) => upper[b]! - upper[a]!);
  let best: ScoredArea | null = null;
  let runnerUp: ScoredArea | null = null;
  let evaluated = 0;
  let solves = 0;
  for (const i of order) {
    // Sorted by bound: once the bound (with a margin over the solver tolerance) cannot beat the runner-up, stop.
    if (runnerUp && upper[i]! + 1e-6 <= runnerUp.score) break;
    const c = candidates[i]!;
    const hydraulics = calculateArea(network, flowingOf(c.headIds), settings, hose);
    evaluated++;
    solves += hydraulics.solves;
    const scored = { candidate: c, hydraulics, score: demandScore(hydraulics) };
    if (!best || scored.score > best.score) { runnerUp = best; best = scored; }
    else if (!runnerUp || scored.score > runnerUp.score) runnerUp = scored;
  }
  return { best, runnerUp, candidates: candidates.length, evaluated, solves, pruned: bound !== null };
}
