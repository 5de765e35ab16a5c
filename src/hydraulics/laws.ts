// The loss laws of hydraulic links: each gives the pressure lost across the link at a flow, loss(q), and its
// slope, dloss/dq, which is all a Newton solver or a series walk needs. A new kind of element is one law here.

import { HW_EXPONENT } from './hazen-williams.js';

/** A law p = loss(q): psi lost from the link's upstream end to its downstream end at flow q (gpm). */
export interface LinkLaw {
  readonly kind: 'hazen-williams' | 'emitter' | 'fixed-curve' | 'pump';
  loss(q: number): number;
  /** d loss / d q, psi per gpm (the Newton step's coefficient; where it vanishes the solver floors it). */
  slope(q: number): number;
}

/**
 * A law with one coefficient, as the network solver keeps it in a typed array per link (a pipe's resistance, a
 * head's K) rather than as an object per link.
 */
export interface LawFamily {
  readonly kind: LinkLaw['kind'];
  loss(coefficient: number, q: number): number;
  slope(coefficient: number, q: number): number;
  /** Both at once into out[0] (loss) and out[1] (slope), bit for bit the two above: a solver's inner loop. */
  lossAndSlope(coefficient: number, q: number, out: Float64Array): void;
}

/** |q|^0.85 by exp and log (twice as fast as the power operator in V8). */
const pow085 = (absQ: number): number => (absQ > 0 ? Math.exp((HW_EXPONENT - 1) * Math.log(absQ)) : 0);

/** Pipes: p = r·|q|^0.85·q (NFPA 13 (2019 edition), 28.2.2.1 Hazen-Williams form; r from `resistance`). */
export const HAZEN_WILLIAMS: LawFamily = {
  kind: 'hazen-williams',
  loss: (r, q) => r * pow085(Math.abs(q)) * q,
  slope: (r, q) => HW_EXPONENT * r * pow085(Math.abs(q)),
  lossAndSlope: (r, q, out) => {
    const p = pow085(Math.abs(q));
    out[0] = r * p * q;
    out[1] = HW_EXPONENT * r * p;
  },
};

/** Heads discharging to the atmosphere: q = K·√p (the K-factor formula, from memory), so p = q·|q| / K². */
const emitterLoss = (k: number, q: number) => (q * Math.abs(q)) / (k * k);
const emitterSlope = (k: number, q: number) => (2 * Math.abs(q)) / (k * k);
export const EMITTER: LawFamily = {
  kind: 'emitter',
  loss: emitterLoss,
  slope: emitterSlope,
  lossAndSlope: (k, q, out) => {
    out[0] = emitterLoss(k, q);
    out[1] = emitterSlope(k, q);
  },
};

/** One link of a family, as an object (a part of the supply path). */
export function lawOf(family: LawFamily, coefficient: number): LinkLaw {
  return { kind: family.kind, loss: (q) => family.loss(coefficient, q), slope: (q) => family.slope(coefficient, q) };
}

/** Points (flow, pressure) with flows rising, as a config gives a device's loss or a pump's curve. */
export type CurvePoints = readonly (readonly [number, number])[];

/** The pressure of a curve at a flow: linear between points, held at the end points' values beyond them. */
function interpolate(points: CurvePoints, q: number): { value: number; slope: number } {
  const first = points[0]!;
  if (q <= first[0]) return { value: first[1], slope: 0 };
  for (let i = 1; i < points.length; i++) {
    const [q1, p1] = points[i]!;
    if (q <= q1) {
      const [q0, p0] = points[i - 1]!;
      const slope = (p1 - p0) / (q1 - q0);
      return { value: p0 + slope * (q - q0), slope };
    }
  }
  return { value: points.at(-1)![1], slope: 0 };
}

/**
 * A device with a published loss curve (a backflow preventer, an alarm valve): the loss interpolated from its
 * points, held flat past the last. Flow the wrong way loses as much the other way (a check valve is not modelled).
 */
export function fixedCurveLaw(points: CurvePoints): LinkLaw {
  return {
    kind: 'fixed-curve',
    loss: (q) => Math.sign(q) * interpolate(points, Math.abs(q)).value,
    slope: (q) => interpolate(points, Math.abs(q)).slope,
  };
}

/**
 * A pump: it adds the pressure of its curve at the flow (a negative loss), interpolated from its points, and
 * nothing past the last point (the contract's rule: no boost beyond the curve). It passes no reverse flow: a
 * flow backwards meets a wall of loss, so a solver drives it to zero.
 */
export function pumpLaw(points: CurvePoints): LinkLaw {
  const lastFlow = points.at(-1)![0];
  const boost = (q: number) => (q > lastFlow ? { value: 0, slope: 0 } : interpolate(points, q));
  return {
    kind: 'pump',
    loss: (q) => (q < 0 ? -points[0]![1] - REVERSE_WALL * q : -boost(q).value),
    slope: (q) => (q < 0 ? REVERSE_WALL : -boost(q).slope),
  };
}

/** psi per gpm against a pump's reverse flow: its check valve, as a steep law a solver can still linearise. */
const REVERSE_WALL = 1e6;
