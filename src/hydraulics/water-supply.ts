// The water supply from a flow test at the source: static pressure Ps, residual Pr while flowing Qr;
// available P(Q) = Ps − (Ps − Pr)·(Q/Qr)^1.85 (confirmed, the NFPA 291 form), a straight line on Q^1.85 paper.

export interface FlowTest {
  static: number;
  residual: number;
  flow: number;
}

/** Pressure the supply gives at a flow: the NFPA 291 line, and nothing beyond where it reaches zero. */
export function availablePressure(test: FlowTest, flowGpm: number): number {
  return Math.max(0, test.static - (test.static - test.residual) * (Math.max(0, flowGpm) / test.flow) ** 1.85);
}

/** The flow at which the supply's line reaches zero pressure (Infinity for a test without pressure drop). */
export function flowAtZeroPressure(test: FlowTest): number {
  const drop = test.static - test.residual;
  return drop > 0 ? test.flow * (test.static / drop) ** (1 / 1.85) : Number.POSITIVE_INFINITY;
}
