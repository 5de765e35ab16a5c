// Drawing length units: the DXF `$INSUNITS` codes the tool accepts and their size in feet.
// Inside the tool every length is in feet; reports convert at the edge.

import type { LengthUnit } from './types.js';

/** Feet per drawing unit (exact by definition of the inch: 1 in = 25.4 mm). */
export const FEET_PER_UNIT: Record<LengthUnit, number> = {
  in: 1 / 12,
  ft: 1,
  mm: 1 / 304.8,
  cm: 1 / 30.48,
  m: 1 / 0.3048,
};

/** DXF `$INSUNITS` codes: 1 in, 2 ft, 4 mm, 5 cm, 6 m (DXF reference, header section). */
const INSUNITS: Record<number, LengthUnit> = { 1: 'in', 2: 'ft', 4: 'mm', 5: 'cm', 6: 'm' };

export function unitFromInsunits(code: unknown): LengthUnit | null {
  return typeof code === 'number' ? (INSUNITS[code] ?? null) : null;
}
