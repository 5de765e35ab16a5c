// Density/area curves and adjustments: OH2 at 0.20/1500, 0.17 at 3000 ft², about 0.15 at 3900 ft²
// (check values consistent with the OH2 line, common practice); +30% for dry systems (confirmed).

import { describe, expect, it } from 'vitest';
import { parseSettings } from '../config/settings.js';
import { curveDensity, designBasis, quickResponseReduction } from './design-basis.js';

describe('density/area curves', () => {
  it('OH2 line: 0.20 at 1500, 0.17 at 3000, about 0.15 at 3900 ft² (common practice check values)', () => {
    expect(curveDensity('OH2', 1500)).toBeCloseTo(0.2, 9);
    expect(curveDensity('OH2', 3000)).toBeCloseTo(0.17, 9);
    expect(curveDensity('OH2', 3900)).toBeCloseTo(0.152, 3);
    expect(curveDensity('OH2', 1000)).toBeNull();
  });
  it('without density and area, the start point of the curve (LH 0.10/1500, EH1 0.30/2500; confirmed)', () => {
    expect(designBasis(parseSettings({ design: { hazard: 'LH' } }).design)).toMatchObject({ density: 0.1, area: 1500, hoseAllowance: 100 });
    expect(designBasis(parseSettings({ design: { hazard: 'EH1' } }).design)).toMatchObject({
      density: 0.3,
      area: 2500,
      hoseAllowance: 500,
    });
  });
  it('an area alone takes its density from the curve', () => {
    expect(designBasis(parseSettings({ design: { hazard: 'OH2', area: 3000 } }).design).density).toBeCloseTo(0.17, 9);
  });
  it('dry and preaction systems add 30% (1500 → 1950 ft², confirmed by a trade article)', () => {
    expect(designBasis(parseSettings({ design: { hazard: 'OH1', systemType: 'dry' } }).design).area).toBeCloseTo(1950, 9);
    expect(designBasis(parseSettings({ design: { hazard: 'OH1', systemType: 'preaction' } }).design).area).toBeCloseTo(1950, 9);
  });
  it('quick-response reduction: 40% at 10 ft, 25% at 20 ft (from memory), never below 768 ft²', () => {
    expect(quickResponseReduction(8)).toBe(40);
    expect(quickResponseReduction(20)).toBe(25);
    expect(quickResponseReduction(15)).toBeCloseTo(32.5, 9);
    const b = designBasis(parseSettings({ design: { hazard: 'OH2', quickResponse: true, ceilingHeight: 10 } }).design);
    expect(b.area).toBeCloseTo(900, 9);
    const lh = designBasis(
      parseSettings({ design: { hazard: 'LH', area: 1200, density: 0.1, quickResponse: true, ceilingHeight: 9 } }).design,
    );
    expect(lh.area).toBe(768);
    expect(designBasis(parseSettings({ design: { hazard: 'OH2', quickResponse: true } }).design).area).toBe(1500);
  });
});
