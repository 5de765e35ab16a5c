// The water supply at the source: the flow test's curve at its test point carried through the supply path (pipes,
// devices, pumps, in order from the test point), each part by its own law; what the search and the report compare.

import type { Settings } from '../config/settings.js';
import { INSIDE_DIAMETER, type NominalSize, type Schedule } from '../quantities/pipe-sizes.js';
import { PSI_PER_FT, resistance } from './hazen-williams.js';
import { type CurvePoints, fixedCurveLaw, HAZEN_WILLIAMS, type LinkLaw, lawOf, pumpLaw } from './laws.js';
import { availablePressure, type FlowTest } from './water-supply.js';

/** A part of the supply path as the config gives it (US units). */
export type PathPart =
  | { type: 'pipe'; length: number; size: NominalSize; cFactor: number; schedule: Schedule; rise: number }
  | { type: 'device'; name: string; loss: CurvePoints }
  | { type: 'pump'; name: string; curve: CurvePoints };

export interface SupplySettings extends FlowTest {
  /** Elevation of the flow-test point, ft (same datum as the source); absent: the source's own. */
  elevation?: number | undefined;
  path?: PathPart[] | undefined;
}

/** One part's share at a flow, from the test point towards the source. */
export interface PathStep {
  part: number;
  type: PathPart['type'] | 'elevation';
  name: string;
  flow: number;
  /** Pressure lost across the part (negative: a pump's boost), psi. */
  loss: number;
  /** Pressure available at its upstream (test-point) and downstream (source) ends, psi. */
  pressureFrom: number;
  pressureTo: number;
}

export interface SupplyAtSource {
  /** Pressure available at the source while the path carries flow q (gpm), psi; never below zero. */
  available(q: number): number;
  /** The walk from the test point to the source at flow q, one step a part (and the level difference). */
  steps(q: number): PathStep[];
  /** Whether `available` never rises with flow: what the design-area search's proof needs (see its header). */
  nonIncreasing: boolean;
  /** Whether there is a path at all (else the source is the test point). */
  hasPath: boolean;
}

interface Part {
  type: PathPart['type'] | 'elevation';
  name: string;
  law: LinkLaw | null;
  /** Static loss (a rise), psi. */
  lift: number;
}

const made = new WeakMap<object, SupplyAtSource>();

/** The settings' supply at the source (made once per settings object), or null without a flow test. */
export function supplyOf(settings: Settings): SupplyAtSource | null {
  const supply = settings.supply;
  if (!supply) return null;
  let at = made.get(supply);
  if (!at) made.set(supply, (at = supplyAtSource(supply, settings.defaults.sourceElevation)));
  return at;
}

/** The supply at the source, for a flow test and path; `sourceElevation` in ft. */
export function supplyAtSource(supply: SupplySettings, sourceElevation: number): SupplyAtSource {
  const parts = pathParts(supply, sourceElevation);
  const lossOf = (part: Part, q: number) => (part.law ? part.law.loss(q) : 0) + part.lift;
  const walk = (q: number): PathStep[] => {
    let p = availablePressure(supply, q);
    return parts.map((part, i) => {
      const loss = lossOf(part, q);
      const step = { part: i, type: part.type, name: part.name, flow: q, loss, pressureFrom: p, pressureTo: p - loss };
      p -= loss;
      return step;
    });
  };
  // The search asks this once per candidate it scores: the losses summed, no steps made.
  const available = (q: number) => {
    let p = availablePressure(supply, q);
    for (const part of parts) p -= lossOf(part, q);
    return Math.max(0, p);
  };
  return {
    available,
    steps: walk,
    nonIncreasing: (supply.path ?? []).every((part) => part.type === 'pipe' || curveMonotone(part, part.type === 'device' ? 1 : -1)),
    hasPath: parts.length > 0,
  };
}

function pathParts(supply: SupplySettings, sourceElevation: number): Part[] {
  const parts: Part[] = (supply.path ?? []).map((part, i): Part => {
    if (part.type === 'pipe') {
      const r = resistance(part.length, part.cFactor, INSIDE_DIAMETER[part.schedule][part.size]);
      return { type: 'pipe', name: `pipe ${i + 1} (${part.size} in)`, law: lawOf(HAZEN_WILLIAMS, r), lift: PSI_PER_FT * part.rise };
    }
    if (part.type === 'device') return { type: 'device', name: part.name, law: fixedCurveLaw(part.loss), lift: 0 };
    return { type: 'pump', name: part.name, law: pumpLaw(part.curve), lift: 0 };
  });
  // The level difference from the test point to the source that the pipes' rises do not account for.
  if (supply.elevation !== undefined) {
    const rises = (supply.path ?? []).reduce((sum, part) => sum + (part.type === 'pipe' ? part.rise : 0), 0);
    const rest = sourceElevation - supply.elevation - rises;
    if (Math.abs(rest) > 1e-9) parts.push({ type: 'elevation', name: 'level difference', law: null, lift: PSI_PER_FT * rest });
  }
  return parts;
}

/** A device's loss that never falls with flow (direction 1), or a pump's boost that never rises (−1). */
function curveMonotone(part: { loss: CurvePoints } | { curve: CurvePoints }, direction: 1 | -1): boolean {
  const points = 'loss' in part ? part.loss : part.curve;
  return points.every((p, i) => i === 0 || direction * (p[1] - points[i - 1]![1]) >= 0);
}

/** The flow at which the supply at the source reaches zero (bisection; the curve is non-increasing), or Infinity. */
export function flowAtZeroSupply(supply: SupplyAtSource, upTo: number): number {
  if (supply.available(upTo) > 0) return Number.POSITIVE_INFINITY;
  let lo = 0;
  let hi = upTo;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (supply.available(mid) > 0) lo = mid;
    else hi = mid;
  }
  return hi;
}
