// Finds the hydraulically most demanding design area and the runner-up: candidates in order of a safe upper
// bound (trees) or an estimate (loops), each ruled out by one or two solves that prove it, or calculated.
//
// Why a solve proves it (any topology, with elevations): raising the source pressure raises every node's
// pressure and every flow (each pipe's and head's flow rises with its pressure difference, and no water is
// stored: a comparison principle). So if every head of an area gets its required pressure at a trial pressure
// P, the area needs at most P and then flows at most Q(P): its score (source pressure, or pressure short of the
// supply) is at most P − supply(Q(P) + hose), as long as the supply does not rise with flow (a flow test, pipes and
// devices never do; a pump whose curve rises somewhere does, and then every candidate is calculated). The proof
// and the bounds cover pipes and heads flowing at the total pressure: with velocity pressure asked for, the areas
// are ranked at the total pressure and the two found are calculated at the normal pressure (ranked again so).
//
// One solve proves several placements at once: opening more heads lowers every node's pressure and raises the
// source flow at a given source pressure (the same comparison principle: the added outflow pulls every head
// down, so each pipe at the source carries more). So if every head of the union of some placements gets its
// required pressure at P, each placement does, and flows at most the union's flow there.

import type { Settings } from '../config/settings.js';
import { AreaCalculator, type AreaDemand, type AreaHydraulics } from '../hydraulics/calculate.js';
import type { FlowingHead } from '../hydraulics/model.js';
import { supplyOf } from '../hydraulics/supply-path.js';
import type { Network } from '../network/types.js';
import { headsOfAnyGroup, lastRun, memberCount, membersOf, unionOf, type Candidate, type CandidateGroup } from './candidates.js';
import { spanningTreeModel, treeBound, type Demand } from '../hydraulics/k-factor-walk.js';

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

/**
 * How many neighbouring placements of a looped system one solve tries to rule out at once. Pairs: on the
 * 5,040-head grid of the bench 284,125 → 183,009 solves (83 → 49 s) for the same areas. On the 1,000-head grid
 * (26,297 solves one by one) pairs took 20,143, windows of 3 and 4 20,683 and 21,647, one doubled on each success
 * 21,932, windows of 8 40,215: a wider union overloads the next line and its proof fails more often.
 */
const WINDOW = 2;

/**
 * How many of a looped system's candidates are taken in the order of the estimate before the rest follow in the
 * order of their groups: a share, and at least a few. On the 5,040-head grid of the bench (282,003 placements),
 * all in the estimate's order: 225,935 solves, 46.9 s; the first 1% so, then the groups' order: 183,449 solves,
 * 23.8 s (Newton iterations a proving solve 6.3 → 4.0), the same two areas. On the 1,000-head grid 24,146 →
 * 19,030 solves for 1%, 20,687 for 10%.
 */
const LEAD_SHARE = 0.01;
const LEAD_MIN = 32;

/**
 * After a window's proof fails, how many candidates are tried alone before windows again: in the groups' order
 * failures come in runs (placements near the runner-up's demand), and each failed window costs a solve. On the
 * 1,000-head grid 19,030 solves → 17,481 (1), 16,650 (4), 16,507 (8), 16,664 (16), 16,724 (64).
 */
const ALONE_AFTER_FAILURE = 8;

/** The placements `from` … `from + count − 1` of a group's leftover, as a group of their own. */
const placementsOf = (g: CandidateGroup, from: number, count: number): CandidateGroup =>
  g.next ? { ...g, next: { ...g.next, first: g.next.first + from, last: g.next.first + from + count - 1 } } : g;

/** An area's score: the supply's shortfall at the source (−margin) with a supply, else the source pressure. */
const demandScore = (supply: ReturnType<typeof supplyOf>, pressure: number, totalFlow: number): number =>
  supply ? pressure - supply.available(totalFlow) : pressure;

/** The two areas a search at the total pressure found, calculated at the normal pressure and ranked again. */
function rankedAtNormalPressure(
  chosen: Candidate[],
  network: Network,
  sourceNodeId: string,
  flowingOf: (ids: string[]) => FlowingHead[],
  settings: Settings,
  hose: number,
): Pick<SearchOutcome, 'best' | 'runnerUp'> {
  if (!chosen.length) return { best: null, runnerUp: null };
  const calculator = new AreaCalculator(network, sourceNodeId, flowingOf([...new Set(chosen.flatMap((c) => c.headIds))]), settings);
  const supply = supplyOf(settings);
  const ranked = chosen
    .map((candidate) => {
      const hydraulics = calculator.calculate(candidate.headIds, hose);
      return { candidate, hydraulics, score: demandScore(supply, hydraulics.sourcePressure, hydraulics.totalDemand) };
    })
    .sort((a, b) => b.score - a.score);
  return { best: ranked[0] ?? null, runnerUp: ranked[1] ?? null };
}

/** Margin over the solver's pressure tolerance when comparing scores, psi. */
const SCORE_TOL = 1e-5;

export interface SearchOptions {
  /** False: every candidate calculated, none ruled out (the brute force the tests compare with). */
  prune?: boolean;
  /** Called once the model of every head is built and bounded, where the search's setting-up is garbage. */
  onGarbage?: (() => void) | undefined;
}

/** What a search is asked: the groups of candidates on the system fed from `sourceNodeId`, and how heads flow. */
interface SearchTask {
  network: Network;
  sourceNodeId: string;
  groups: CandidateGroup[];
  flowingOf: (ids: string[]) => FlowingHead[];
  settings: Settings;
  hose: number;
  options: SearchOptions;
}

/** The most demanding design area and the runner-up among the groups' candidates, with their tables. */
export function searchMostDemanding(
  network: Network,
  sourceNodeId: string,
  groups: CandidateGroup[],
  flowingOf: (ids: string[]) => FlowingHead[],
  settings: Settings,
  hose: number,
  options: SearchOptions = {},
): SearchOutcome {
  const task = { network, sourceNodeId, groups, flowingOf, settings, hose, options };
  if (settings.design.velocityPressure) {
    // The tables of the two found are made at the normal pressure only: the search's model of every head is
    // garbage by then (on 20,000 heads its two tables cost tens of megabytes).
    const atTotal = { ...settings, design: { ...settings.design, velocityPressure: false } };
    const { top, stats } = rankAtTotalPressure({ ...task, settings: atTotal });
    const chosen = [top.best, top.runnerUp].flatMap((x) => (x ? [x.candidate] : []));
    return { ...stats, ...rankedAtNormalPressure(chosen, network, sourceNodeId, flowingOf, settings, hose) };
  }
  const { top, stats, calculator } = rankAtTotalPressure(task);
  const withTables = (x: Scored | null): ScoredArea | null =>
    x && calculator && { candidate: x.candidate, score: x.score, hydraulics: calculator.hydraulicsOf(x.demand, hose) };
  return { ...stats, best: withTables(top.best), runnerUp: withTables(top.runnerUp) };
}

/** The two most demanding candidates at the total pressure, with the search's counts and its calculator. */
function rankAtTotalPressure({ network, sourceNodeId, groups, flowingOf, settings, hose, options }: SearchTask): {
  top: { best: Scored | null; runnerUp: Scored | null };
  stats: Omit<SearchOutcome, 'best' | 'runnerUp'>;
  calculator: AreaCalculator | null;
} {
  const candidates = groups.reduce((n, g) => n + memberCount(g), 0);
  const all = flowingOf(headsOfAnyGroup(groups));
  if (all.length === 0) {
    return {
      top: { best: null, runnerUp: null },
      stats: { candidates, evaluated: 0, screened: 0, solves: 0, pruned: false },
      calculator: null,
    };
  }
  const supply = supplyOf(settings);
  // The proof needs a supply that never rises with flow (a pump curve that rises somewhere turns pruning off).
  const prune = options.prune !== false && (supply === null || supply.nonIncreasing);
  const calculator = new AreaCalculator(network, sourceNodeId, all, settings);
  const bound = prune ? treeBound(calculator.model, calculator.solver.skeleton) : null;
  options.onGarbage?.();
  const scoreAt = (pressure: number, flow: number) => demandScore(supply, pressure, flow + hose);
  const scoreOf = (d: Demand | null | undefined) => (d ? scoreAt(d.pressure, d.flow) : null);
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
    let P = supply ? target + supply.available((lastFlow ? 1.01 * lastFlow : 1.03 * r.sourceFlow) + hose) : r.sourcePressure;
    for (let attempt = 0; attempt < 2; attempt++) {
      const at = calculator.satisfiedAt(heads, P);
      solves++;
      if (!at.satisfied) return false;
      if (scoreAt(P, at.flow) <= target) {
        lastFlow = at.flow;
        return true;
      }
      if (!supply) return false;
      P = target + supply.available(at.flow + hose);
    }
    return false;
  };
  const beaten = (upper: number) => top.runnerUp !== null && upper + SCORE_TOL <= top.runnerUp.score;
  /** A candidate: ruled out by its bound or a proof, else calculated. */
  const consider = (c: Candidate, upper: number) => {
    if (prune && (beaten(upper) || ruledOut(c.headIds))) {
      screened++;
      return;
    }
    const demand = calculator.demand(c.headIds);
    evaluated++;
    solves += demand.solves;
    const scored = { candidate: c, demand, score: scoreAt(demand.sourcePressure, demand.sourceFlow) };
    // Areas that tie to within the solver's tolerance (mirror images) keep the order they were found in, so the
    // last digits of a solve do not choose between them.
    if (!top.best || scored.score > top.best.score + SCORE_TOL) {
      top.runnerUp = top.best;
      top.best = scored;
    } else if (!top.runnerUp || scored.score > top.runnerUp.score + SCORE_TOL) top.runnerUp = scored;
  };

  if (bound) {
    // Trees: groups in order of a bound that holds for all their candidates (every placement of the leftover);
    // once a group cannot beat the runner-up, neither can any group left. Each line's windows are summed once for
    // every group that holds them (the lines are those the groups' leftovers go on: every line but at an edge).
    // 38,597 groups of a 20,000-head tree: bounds 335-515 → 229-310 ms.
    bound.knowLines(new Set(groups.flatMap((g) => (g.next ? [g.next.heads] : []))));
    const upperOfGroup = (g: CandidateGroup, first: number, last: number) =>
      scoreOf(bound.boundOfGroup(g.base, g.next && { heads: g.next.heads, first, last, size: g.next.size })) ?? Infinity;
    const upper = groups.map((g) => upperOfGroup(g, g.next?.first ?? 0, lastRun(g)));
    const order = groups.map((_, i) => i).sort((a, b) => upper[b]! - upper[a]!);
    /** A group's placements `first` … `last`, halved while their common bound beats the runner-up (the more demanding half first). */
    const explore = (g: CandidateGroup, first: number, last: number, bounded: number): void => {
      if (beaten(bounded)) {
        screened += last - first + 1;
        return;
      }
      const next = g.next;
      if (!next || first === last) {
        consider(
          {
            headIds: next ? [...g.base, ...next.heads.slice(first, first + next.size)] : g.base,
            lineIds: next ? [...g.lines, next.line] : g.lines,
          },
          bounded,
        );
        return;
      }
      const mid = (first + last) >> 1;
      const firstHalf = upperOfGroup(g, first, mid);
      const secondHalf = upperOfGroup(g, mid + 1, last);
      // The more demanding half first; of two alike, the first.
      if (secondHalf > firstHalf) {
        explore(g, mid + 1, last, secondHalf);
        explore(g, first, mid, firstHalf);
      } else {
        explore(g, first, mid, firstHalf);
        explore(g, mid + 1, last, secondHalf);
      }
    };
    for (let at = 0; at < order.length; at++) {
      const g = groups[order[at]!]!;
      if (beaten(upper[order[at]!]!)) {
        for (const rest of order.slice(at)) screened += memberCount(groups[rest]!);
        break;
      }
      explore(g, g.next?.first ?? 0, lastRun(g), upper[order[at]!]!);
    }
  } else {
    // Looped systems (or no pruning): first the candidates a walk on a spanning tree estimates most demanding, so
    // that a demanding runner-up is found early; then the rest in the order of their groups, where each placement
    // neighbours the last one solved (its solve starts warm from that one's flows, whose flow guesses its own).
    // A candidate not yet decided is first tried with its undecided neighbours along its group (the placements
    // after it), WINDOW of them at once by the proof above; what that does not rule out is considered alone.
    const walk = prune ? treeBound(spanningTreeModel(calculator.model)) : null;
    const members = groups.flatMap((g, group) => membersOf(g).map((candidate, placement) => ({ candidate, group, placement })));
    const estimate = members.map((m) => scoreOf(walk?.bound(m.candidate.headIds)) ?? 0);
    const byEstimate = members.map((_, i) => i).sort((a, b) => estimate[b]! - estimate[a]!);
    const lead = Math.max(LEAD_MIN, Math.ceil(LEAD_SHARE * members.length));
    const order = [...byEstimate.slice(0, lead), ...byEstimate.slice(lead).sort((a, b) => a - b)];
    const decided = new Uint8Array(members.length);
    /** Candidates still to be tried alone since a window's proof failed. */
    let alone = 0;
    for (const k of order) {
      if (decided[k]) continue;
      let run = 1;
      const window = alone > 0 ? 1 : WINDOW;
      while (run < window && k + run < members.length && !decided[k + run] && members[k + run]!.group === members[k]!.group) run++;
      decided.fill(1, k, k + run);
      if (prune && run > 1) {
        if (ruledOut(unionOf(placementsOf(groups[members[k]!.group]!, members[k]!.placement, run)))) {
          screened += run;
          continue;
        }
        alone = ALONE_AFTER_FAILURE;
      } else if (alone > 0) alone--;
      decided.fill(0, k + 1, k + run);
      consider(members[k]!.candidate, Infinity);
    }
  }
  return { top, stats: { candidates, evaluated, screened, solves, pruned: bound !== null }, calculator };
}
