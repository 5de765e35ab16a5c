// The design basis of a hazard: density and area from the config or the density/area curve, area
// adjustments (dry and preaction systems, quick-response heads, sloped ceilings), hose allowance and duration.

import type { DesignSettings, Hazard } from '../config/settings.js';

interface Curve {
  start: [number, number];
  end: [number, number];
}

/**
 * Density/area curves, [area ft², density gpm/ft²], NFPA 13 (2019 edition), Figure 19.3.3.1.1. Start points
 * confirmed by a secondary source (LH 0.10/1500, OH1 0.15/1500, OH2 0.20/1500, EH1 0.30/2500, EH2 0.40/2500);
 * end points from memory (LH 0.07/3000, OH1 0.10/4000, OH2 0.15/4000, EH1 0.20/5000, EH2 0.30/5000).
 */
export const CURVE_SOURCE =
  'NFPA 13 (2019 edition), Figure 19.3.3.1.1, density/area curves: start points confirmed by a secondary source, end points from memory';

export const CURVES: Record<Hazard, Curve> = {
  LH: { start: [1500, 0.1], end: [3000, 0.07] },
  OH1: { start: [1500, 0.15], end: [4000, 0.1] },
  OH2: { start: [1500, 0.2], end: [4000, 0.15] },
  EH1: { start: [2500, 0.3], end: [5000, 0.2] },
  EH2: { start: [2500, 0.4], end: [5000, 0.3] },
};

/** Hose-stream allowance, gpm: LH 100, OH 250, EH 500 (confirmed); duration, min: LH 30, OH 60 (confirmed), EH 90 (from memory). */
const HOSE: Record<Hazard, { gpm: number; minutes: number }> = {
  LH: { gpm: 100, minutes: 30 },
  OH1: { gpm: 250, minutes: 60 },
  OH2: { gpm: 250, minutes: 60 },
  EH1: { gpm: 500, minutes: 90 },
  EH2: { gpm: 500, minutes: 90 },
};

/** Density on the curve at `area` (linear between its end points), or null outside them. */
export function curveDensity(hazard: Hazard, area: number): number | null {
  const { start, end } = CURVES[hazard];
  if (area < start[0] - 1e-9 || area > end[0] + 1e-9) return null;
  return start[1] + ((area - start[0]) * (end[1] - start[1])) / (end[0] - start[0]);
}

export interface DesignBasis {
  hazard: Hazard;
  density: number;
  /** Design area after adjustments, ft². */
  area: number;
  /** Area before adjustments, ft². */
  baseArea: number;
  hoseAllowance: number;
  durationMinutes: number;
  /** Density on the curve at the base area, for checking a configured point. */
  curveDensity: number | null;
  adjustments: string[];
  source: string;
}

/** Quick-response area reduction, percent, for ceiling height H ft: 40 at ≤ 10 ft, 25 at 20 ft, linear (from memory: NFPA 13 (2019 edition) Figure 19.3.3.2.3). */
export function quickResponseReduction(ceilingHeightFt: number): number {
  if (ceilingHeightFt > 20) return 0;
  return ceilingHeightFt <= 10 ? 40 : 40 - 1.5 * (ceilingHeightFt - 10);
}

/** The basis of a design: config `design`, or a zone's hazard, density and area over it. */
export function designBasis(d: DesignSettings): DesignBasis {
  const curve = CURVES[d.hazard];
  let baseArea = d.area ?? curve.start[0];
  let density = d.density ?? curveDensity(d.hazard, baseArea) ?? curve.start[1];
  const source =
    d.density !== undefined || d.area !== undefined
      ? 'config'
      : `the ${d.hazard} curve at its minimum area (NFPA 13 (2019 edition), Figure 19.3.3.1.1)`;
  if (d.density === undefined && d.area === undefined) {
    baseArea = curve.start[0];
    density = curve.start[1];
  }
  const adjustments: string[] = [];
  let area = baseArea;
  if (d.systemType !== 'wet') {
    area *= 1.3;
    adjustments.push(`${d.systemType} system: area +30% (confirmed; section from memory: NFPA 13 (2019 edition), 19.3.3.2.5)`);
  }
  if (d.ceilingSlope !== undefined && d.ceilingSlope > 2 / 12) {
    area *= 1.3;
    adjustments.push('ceiling slope over 2 in 12: area +30% (from memory: NFPA 13 (2019 edition), 19.3.3.2.4)');
  }
  if (d.quickResponse) {
    const hazardOk = d.hazard === 'LH' || d.hazard === 'OH1' || d.hazard === 'OH2';
    if (d.systemType === 'wet' && hazardOk && d.ceilingHeight !== undefined && d.ceilingHeight <= 20) {
      const pct = quickResponseReduction(d.ceilingHeight);
      area = Math.max(area * (1 - pct / 100), Math.min(area, 768));
      adjustments.push(
        `quick-response heads under a ${d.ceilingHeight} ft ceiling: area −${pct.toFixed(1)}% (from memory: NFPA 13 (2019 edition), 19.3.3.2.3; not below 768 ft²)`,
      );
    } else {
      adjustments.push(
        'quick-response reduction not applied (needs a wet system, light or ordinary hazard and design.ceilingHeight ≤ 20 ft)',
      );
    }
  }
  const hose = HOSE[d.hazard];
  return {
    hazard: d.hazard,
    density,
    area,
    baseArea,
    hoseAllowance: d.hoseAllowance ?? hose.gpm,
    durationMinutes: hose.minutes,
    curveDensity: curveDensity(d.hazard, baseArea),
    adjustments,
    source,
  };
}
