// Equivalent pipe lengths of fittings for friction (45° elbow, 90° standard elbow, 90° long-turn elbow,
// tee or cross with flow turned 90°), Schedule 40 steel at C = 120, with the C and inside-diameter factors.

import type { NominalSize } from '../quantities/pipe-sizes.js';
import { INSIDE_DIAMETER } from '../quantities/pipe-sizes.js';

export interface FittingLengths {
  elbow45: number;
  elbow90: number;
  longTurn90: number;
  teeTurn: number;
}

/**
 * Feet, Schedule 40 steel, C = 120. NFPA 13 (2019 edition), Table 28.2.3.1.1: sizes 1, 2 and 4 confirmed
 * (1 in 1/2/2/5; 2 in 2/5/3/10; 4 in 4/10/6/20); the other sizes from memory of the same table.
 */
export const EQUIVALENT_LENGTH_FT: Record<NominalSize, FittingLengths> = {
  '1/2': { elbow45: 1, elbow90: 1, longTurn90: 1, teeTurn: 3 },
  '3/4': { elbow45: 1, elbow90: 2, longTurn90: 1, teeTurn: 4 },
  '1': { elbow45: 1, elbow90: 2, longTurn90: 2, teeTurn: 5 },
  '1-1/4': { elbow45: 1, elbow90: 3, longTurn90: 2, teeTurn: 6 },
  '1-1/2': { elbow45: 2, elbow90: 4, longTurn90: 2, teeTurn: 8 },
  '2': { elbow45: 2, elbow90: 5, longTurn90: 3, teeTurn: 10 },
  '2-1/2': { elbow45: 3, elbow90: 6, longTurn90: 4, teeTurn: 12 },
  '3': { elbow45: 3, elbow90: 7, longTurn90: 5, teeTurn: 15 },
  '3-1/2': { elbow45: 3, elbow90: 8, longTurn90: 5, teeTurn: 17 },
  '4': { elbow45: 4, elbow90: 10, longTurn90: 6, teeTurn: 20 },
  '5': { elbow45: 5, elbow90: 12, longTurn90: 8, teeTurn: 25 },
  '6': { elbow45: 7, elbow90: 14, longTurn90: 9, teeTurn: 30 },
  '8': { elbow45: 9, elbow90: 18, longTurn90: 13, teeTurn: 35 },
};

/**
 * Multiplier for a C-factor other than 120: (C/120)^1.85 (derived; a European rulebook gives 0.714 at C 100,
 * 1.16 at 130, 1.33 at 140, 1.51 at 150), and for an inside diameter other than Schedule 40's:
 * (d / d_sch40)^4.87 (from memory: NFPA 13's note to the same table).
 */
export function fittingFactor(c: number, size: NominalSize, insideDiameterIn: number): number {
  return (c / 120) ** 1.85 * (insideDiameterIn / INSIDE_DIAMETER['40'][size]) ** 4.87;
}
