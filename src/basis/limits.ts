// The limit table for standard-spray upright and pendent heads, following one stated NFPA 13 edition;
// each value says where it comes from. `limits` in the config overrides any value (adopted editions differ).

import type { Hazard, Settings } from '../config/settings.js';

export const EDITION = 'NFPA 13 (2019 edition)';

export type HazardGroup = 'LH' | 'OH' | 'EH';

export interface Limits {
  edition: string;
  hazardGroup: HazardGroup;
  /** Maximum protection area per head, ft². */
  maxArea: number;
  /** Maximum distance between heads on a branch line and between branch lines, ft. */
  maxSpacing: number;
  /** Maximum distance from a head to a wall, ft. */
  maxWallDistance: number;
  /** Minimum distance from a head to a wall, ft. */
  minWallDistance: number;
  /** Minimum distance between heads, ft. */
  minHeadDistance: number;
  /** Source of each value. */
  sources: Record<LimitKey, string>;
}

export type LimitKey = 'maxArea' | 'maxSpacing' | 'maxWallDistance' | 'minWallDistance' | 'minHeadDistance';
const LIMIT_KEYS: readonly LimitKey[] = ['maxArea', 'maxSpacing', 'maxWallDistance', 'minWallDistance', 'minHeadDistance'];

interface Row {
  maxArea: number;
  maxSpacing: number;
  areaSource: string;
  spacingSource: string;
}

/** Standard-spray table rows per hazard group. */
const TABLE: Record<HazardGroup, Row> = {
  LH: {
    maxArea: 225,
    maxSpacing: 15,
    areaSource: `${EDITION}, Table 10.2.4.2.1(a): 225 ft² hydraulically calculated, noncombustible unobstructed (confirmed; 130 ft² for some combustible obstructed construction)`,
    spacingSource: `${EDITION}, Table 10.2.4.2.1(a): 15 ft (from memory)`,
  },
  OH: {
    maxArea: 130,
    maxSpacing: 15,
    areaSource: `${EDITION}, Table 10.2.4.2.1(b): 130 ft² (confirmed)`,
    spacingSource: `${EDITION}, Table 10.2.4.2.1(b): 15 ft (from memory)`,
  },
  EH: {
    maxArea: 100,
    maxSpacing: 12,
    areaSource: `${EDITION}, Table 10.2.4.2.1(c): 100 ft² hydraulically calculated (confirmed; 130 ft² where density < 0.25 gpm/ft²)`,
    spacingSource: `${EDITION}, Table 10.2.4.2.1(c): 12 ft (from memory)`,
  },
};

export function hazardGroup(h: Hazard): HazardGroup {
  return h === 'LH' ? 'LH' : h === 'OH1' || h === 'OH2' ? 'OH' : 'EH';
}

/**
 * The limits in force for a hazard (and its density, where the table depends on it), with the config's `limits`
 * overrides applied: they stand for the adopted code and hold for every hazard.
 */
export function resolveLimits(hazard: Hazard, density: number | undefined, overrides: Settings['limits']): Limits {
  const group = hazardGroup(hazard);
  const row = TABLE[group];
  const ehLowDensity = group === 'EH' && density !== undefined && density < 0.25;
  const limits: Limits = {
    edition: EDITION,
    hazardGroup: group,
    maxArea: ehLowDensity ? 130 : row.maxArea,
    maxSpacing: row.maxSpacing,
    maxWallDistance: row.maxSpacing / 2,
    minWallDistance: 4 / 12,
    minHeadDistance: 6,
    sources: {
      maxArea: row.areaSource,
      maxSpacing: row.spacingSource,
      maxWallDistance: `${EDITION}, 10.2.5.2.1: half the allowed maximum spacing (confirmed)`,
      minWallDistance: `${EDITION}, 10.2.5.2.3: 4 in (confirmed)`,
      minHeadDistance: `${EDITION}, 10.2.5.3.1: 6 ft unless baffles separate the heads (from memory)`,
    },
  };
  for (const k of LIMIT_KEYS) {
    const value = overrides[k];
    if (value === undefined) continue;
    limits[k] = value;
    limits.sources[k] = `config override of ${k} (the adopted code)`;
    if (k === 'maxSpacing' && overrides.maxWallDistance === undefined) limits.maxWallDistance = value / 2;
  }
  return limits;
}
