// Each loss law against values worked by hand from its formula, and its slope against the loss's own numerical
// derivative (what the Newton step relies on), for every law at flows across its range.

import { describe, expect, it } from 'vitest';
import { resistance } from './hazen-williams.js';
import { EMITTER, fixedCurveLaw, HAZEN_WILLIAMS, type LinkLaw, lawOf, pumpLaw } from './laws.js';

// Device and pump curves as the contract's examples give them (CONTRACT.md, Supply path; invented equipment).
const DEVICE: [number, number][] = [
  [0, 4],
  [500, 7],
  [1500, 12],
];
const PUMP: [number, number][] = [
  [0, 120],
  [750, 110],
  [1000, 100],
  [1500, 65],
];

describe('loss laws: hand values', () => {
  it.each([
    // NFPA 13 (2019 edition), 28.2.2.1: p = 4.52·Q^1.85/(C^1.85·d^4.87) per ft; 24 gpm, 1 in Sch 40 (1.049 in), C 120,
    // 100 ft: 0.18233 psi/ft × 100 (hand value, test/hydraulics: same formula).
    ['pipe, 24 gpm', lawOf(HAZEN_WILLIAMS, resistance(100, 120, 1.049)), 24, 18.233],
    ['pipe, reverse flow loses the other way', lawOf(HAZEN_WILLIAMS, resistance(100, 120, 1.049)), -24, -18.233],
    // q = K·√p (from memory): K 5.6 at 7 psi flows 5.6·√7 = 14.8162 gpm.
    ['head K 5.6 at 14.8162 gpm', lawOf(EMITTER, 5.6), 5.6 * Math.sqrt(7), 7],
    // Linear between (0, 4) and (500, 7): 4 + 3·250/500 = 5.5; held at 12 past 1500 (CONTRACT.md).
    ['device at 250 gpm', fixedCurveLaw(DEVICE), 250, 5.5],
    ['device at 1000 gpm', fixedCurveLaw(DEVICE), 1000, 9.5],
    ['device past its last point', fixedCurveLaw(DEVICE), 2000, 12],
    // Boost linear between (0, 120) and (750, 110): 120 − 10·500/750 = 113.333; none past 1500 (CONTRACT.md).
    ['pump at 500 gpm', pumpLaw(PUMP), 500, -113.3333],
    ['pump at 1250 gpm', pumpLaw(PUMP), 1250, -82.5],
    ['pump past its last point', pumpLaw(PUMP), 1600, 0],
  ] as [string, LinkLaw, number, number][])('%s', (_what, law, q, loss) => {
    expect(law.loss(q)).toBeCloseTo(loss, 3);
  });

  it('a pump passes no reverse flow: its loss backwards is a steep wall', () => {
    const pump = pumpLaw(PUMP);
    expect(pump.loss(-0.01)).toBeGreaterThan(pump.loss(0) + 1e3);
    expect(pump.slope(-1)).toBeGreaterThan(1e5);
  });
});

describe('loss laws: the slope is the derivative of the loss', () => {
  const laws: [string, LinkLaw][] = [
    ['pipe', lawOf(HAZEN_WILLIAMS, resistance(50, 120, 2.067))],
    ['head', lawOf(EMITTER, 8)],
    ['device', fixedCurveLaw(DEVICE)],
    ['pump', pumpLaw(PUMP)],
  ];
  // Away from the curves' corner points, where the one-sided derivatives differ.
  const flows = [3, 37, 260, 620, 880, 1230, 1400];
  it.each(laws)('%s', (_name, law) => {
    for (const q of flows) {
      const h = 1e-4;
      const numeric = (law.loss(q + h) - law.loss(q - h)) / (2 * h);
      expect(law.slope(q)).toBeCloseTo(numeric, 6);
    }
  });
});

describe('loss laws: loss and slope at once are the two alone, bit for bit', () => {
  // The solver's inner loop takes both from one call; its results must not move by a rounding (common practice, no source).
  const families = [
    ['pipe', HAZEN_WILLIAMS, resistance(50, 120, 2.067)],
    ['head', EMITTER, 5.6],
  ] as const;
  it.each(families)('%s', (_name, family, coefficient) => {
    const out = new Float64Array(2);
    for (const q of [-880, -3, 0, 1e-9, 3, 37, 260, 1230]) {
      family.lossAndSlope(coefficient, q, out);
      expect([out[0], out[1]]).toEqual([family.loss(coefficient, q), family.slope(coefficient, q)]);
    }
  });
});
