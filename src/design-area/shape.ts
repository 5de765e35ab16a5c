// The shape a design area must have: length along the branch lines at least 1.2·√A, whole heads along it,
// whole heads in all, and the heads left over on the next branch line at the end nearest the cross main.

export interface AreaShape {
  /** Minimum length along the branch lines, ft: 1.2·√A (confirmed: NFPA 13 handbook). */
  minLength: number;
  /** Heads along a branch line: ceil(1.2·√A / S). */
  headsAlong: number;
  /** Heads in the area: ceil(A / protection area per head). */
  totalHeads: number;
  /** Whole branch lines, and heads on the next one. */
  fullLines: number;
  remainder: number;
}

/**
 * @param area design area, ft²
 * @param spacing head spacing S along the branch lines, ft
 * @param perHead protection area per head, ft²
 */
export function areaShape(area: number, spacing: number, perHead: number): AreaShape {
  const minLength = 1.2 * Math.sqrt(area);
  // A tiny tolerance keeps exact quotients (e.g. 1500 / 125 = 12) from rounding up on float noise.
  const headsAlong = Math.max(1, Math.ceil(minLength / spacing - 1e-9));
  const totalHeads = Math.max(headsAlong, Math.ceil(area / perHead - 1e-9));
  const fullLines = Math.floor(totalHeads / headsAlong);
  return { minLength, headsAlong, totalHeads, fullLines, remainder: totalHeads - fullLines * headsAlong };
}
