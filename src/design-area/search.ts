// Finds the hydraulically most demanding design area and the runner-up: candidates in order of a safe upper
// bound (trees), each screened by one solve at the runner-up's pressure before a full calculation.

import type { Settings } from '../config/settings.js';
import { AreaCalculator, type AreaHydraulics } from '../hydraulics/calculate.js';
import type { FlowingHead } from '../hydraulics/model.js';
import { availablePressure } from '../hydraulics/water-supply.js';
import type { Network } from '../network/types.js';
import type { Candidate } from './candidates.js';
import { spanningTreeModel, treeBound } from '../hydraulics/k-factor-walk.js';

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
  /** Candidates fully calculated, and those ruled out by one solve at the runner-up's pressure. */
  evaluated: number;
  screened: number;
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
  if (all.length === 0) return { best: null, runnerUp: null, candidates: candidates.length, evaluated: 0, screened: 0, solves: 0, pruned: false };
  const calculator = new AreaCalculator(network, all, settings);
  const bound = options.prune === false ? null : treeBound(calculator.model);
  const supply = settings.supply;
  const upper = candidates.map((c) => {
    if (!bound) return Infinity;
    const b = bound.bound(c.headIds);
    if (!b) return Infinity;
    return supply ? b.pressure - availablePressure(supply, b.flow + hose) : b.pressure;
  });
  // Without a bound (looped systems) the same walk on a spanning tree orders the candidates: a demanding
  // runner-up found early lets the one-solve screening rule out the rest.
  const estimate = bound ? upper : estimateOnTree(calculator.model, candidates, supply, hose);
  const order = candidates.map((_, i) => i).sort((a, b) => estimate[b]! - estimate[a]! || upper[b]! - upper[a]!);
  let best: ScoredArea | null = null;
  let runnerUp: ScoredArea | null = null;
  let evaluated = 0;
  let screened = 0;
  let solves = 0;
  for (const i of order) {
    // Sorted by bound: once the bound (with a margin over the solver tolerance) cannot beat the runner-up, stop.
    if (runnerUp && upper[i]! + 1e-5 <= runnerUp.score) break;
    const c = candidates[i]!;
    if (runnerUp && options.prune !== false) {
      // Node pressures and flows rise with the source pressure. If every head is satisfied at a trial pressure
      // Pt, the candidate needs P ≤ Pt and flows no more than there, so its score is at most
      // Pt − supply(flow at Pt + hose): when that cannot beat the runner-up, one solve rules it out. With a
      // supply, Pt sits below the runner-up's pressure by what 3% more flow costs on the supply curve.
      const r = runnerUp.hydraulics;
      const Pt = supply
        ? r.sourcePressure - (availablePressure(supply, r.sourceFlow + hose) - availablePressure(supply, 1.03 * r.sourceFlow + hose))
        : r.sourcePressure;
      const at = calculator.satisfiedAt(c.headIds, Pt);
      solves++;
      const boundAtPt = supply ? Pt - availablePressure(supply, at.flow + hose) : Pt;
      if (at.satisfied && boundAtPt <= runnerUp.score) { screened++; continue; }
    }
    const hydraulics = calculator.calculate(c.headIds, hose);
    evaluated++;
    solves += hydraulics.solves;
    const scored = { candidate: c, hydraulics, score: demandScore(hydraulics) };
    if (!best || scored.score > best.score) { runnerUp = best; best = scored; }
    else if (!runnerUp || scored.score > runnerUp.score) runnerUp = scored;
  }
  return { best, runnerUp, candidates: candidates.length, evaluated, screened, solves, pruned: bound !== null };
}

function estimateOnTree(model: AreaCalculator['model'], candidates: Candidate[], supply: Settings['supply'], hose: number): number[] {
  const walk = treeBound(spanningTreeModel(model));
  return candidates.map((c) => {
    const b = walk?.bound(c.headIds);
    if (!b) return 0;
    return supply ? b.pressure - availablePressure(supply, b.flow + hose) : b.pressure;
  });
}
