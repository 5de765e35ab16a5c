// Finds the hydraulically most demanding design area and the runner-up: candidates in order of a safe upper
// bound (trees) or an estimate (loops), each ruled out by one or two solves that prove it, or calculated.
//
// Why a solve proves it (any topology, with elevations): raising the source pressure raises every node's
// pressure and every flow (each pipe's and head's flow rises with its pressure difference, and no water is
// stored: a comparison principle). So if every head of an area gets its required pressure at a trial pressure
// P, the area needs at most P and then flows at most Q(P): its score (source pressure, or pressure short of the
// supply) is at most P − supply(Q(P) + hose).

import type { Settings } from '../config/settings.js';
import { AreaCalculator, type AreaDemand, type AreaHydraulics } from '../hydraulics/calculate.js';
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
  /** Candidates fully calculated, and those ruled out by the proof above. */
  evaluated: number;
  screened: number;
  solves: number;
  /** Whether the bound was available (tree systems). */
  pruned: boolean;
}

interface Scored {
  candidate: Candidate;
  demand: AreaDemand;
  score: number;
}

/** Margin over the solver's pressure tolerance when comparing scores, psi. */
const SCORE_TOL = 1e-5;

export function searchMostDemanding(
  network: Network,
  sourceNodeId: string,
  candidates: Candidate[],
  flowingOf: (ids: string[]) => FlowingHead[],
  settings: Settings,
  hose: number,
  options: { prune?: boolean } = {},
): SearchOutcome {
  // Every head any candidate flows (a set filled head by head: the flat list of all candidates' heads would be
  // twenty times as long as the set).
  const anyArea = new Set<string>();
  for (const c of candidates) for (const id of c.headIds) anyArea.add(id);
  const all = flowingOf([...anyArea]);
  if (all.length === 0)
    return { best: null, runnerUp: null, candidates: candidates.length, evaluated: 0, screened: 0, solves: 0, pruned: false };
  const prune = options.prune !== false;
  const calculator = new AreaCalculator(network, sourceNodeId, all, settings);
  const bound = prune ? treeBound(calculator.model, calculator.solver.skeleton) : null;
  const supply = settings.supply;
  const scoreAt = (pressure: number, flow: number) => (supply ? pressure - availablePressure(supply, flow + hose) : pressure);
  const upper = candidates.map((c) => {
    const b = bound?.bound(c.headIds);
    return b ? scoreAt(b.pressure, b.flow) : Infinity;
  });
  // Without a bound (looped systems) the same walk on a spanning tree estimates which areas are demanding, so
  // that a demanding runner-up is found early and rules out the rest.
  const estimate = bound ? upper : estimateOnTree(calculator.model, candidates, scoreAt);
  /** The two most demanding areas calculated so far. */
  const top: { best: Scored | null; runnerUp: Scored | null } = { best: null, runnerUp: null };
  let evaluated = 0;
  let screened = 0;
  let solves = 0;

  /** The flow of the last area ruled out: neighbouring areas flow alike, so it guesses the next one's. */
  let lastFlow = 0;
  /** Whether the area scores no more than the runner-up, proved by at most two solves. */
  const ruledOut = (heads: string[]): boolean => {
    if (!top.runnerUp) return false;
    const target = top.runnerUp.score;
    const r = top.runnerUp.demand;
    // First at the pressure where a guessed flow would tie with the runner-up; then, if the flow there was
    // larger, at the (lower) pressure where that flow ties.
    let P = supply ? target + availablePressure(supply, (lastFlow ? 1.01 * lastFlow : 1.03 * r.sourceFlow) + hose) : r.sourcePressure;
    for (let attempt = 0; attempt < 2; attempt++) {
      const at = calculator.satisfiedAt(heads, P);
      solves++;
      if (!at.satisfied) return false;
      if (scoreAt(P, at.flow) <= target) {
        lastFlow = at.flow;
        return true;
      }
      if (!supply) return false;
      P = target + availablePressure(supply, at.flow + hose);
    }
    return false;
  };

  const order = candidates.map((_, i) => i).sort((a, b) => estimate[b]! - estimate[a]! || upper[b]! - upper[a]!);
  for (const i of order) {
    const c = candidates[i]!;
    // On trees the order is by bound: once it cannot beat the runner-up, neither can any candidate left.
    if (top.runnerUp && upper[i]! + SCORE_TOL <= top.runnerUp.score) break;
    if (prune && ruledOut(c.headIds)) {
      screened++;
      continue;
    }
    const demand = calculator.demand(c.headIds);
    evaluated++;
    solves += demand.solves;
    const scored = { candidate: c, demand, score: scoreAt(demand.sourcePressure, demand.sourceFlow) };
    if (!top.best || scored.score > top.best.score) {
      top.runnerUp = top.best;
      top.best = scored;
    } else if (!top.runnerUp || scored.score > top.runnerUp.score) top.runnerUp = scored;
  }
  const withTables = (x: Scored | null): ScoredArea | null =>
    x && { candidate: x.candidate, score: x.score, hydraulics: calculator.hydraulicsOf(x.demand, hose) };
  return {
    best: withTables(top.best),
    runnerUp: withTables(top.runnerUp),
    candidates: candidates.length,
    evaluated,
    screened,
    solves,
    pruned: bound !== null,
  };
}

function estimateOnTree(model: AreaCalculator['model'], candidates: Candidate[], scoreAt: (p: number, q: number) => number): number[] {
  const walk = treeBound(spanningTreeModel(model));
  return candidates.map((c) => {
    const b = walk?.bound(c.headIds);
    return b ? scoreAt(b.pressure, b.flow) : 0;
  });
}
