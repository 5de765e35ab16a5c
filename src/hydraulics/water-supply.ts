// The water supply from a flow test at the source: static pressure Ps, residual Pr while flowing Qr;
// available P(Q) = Ps − (Ps − Pr)·(Q/Qr)^1.85 (confirmed, the NFPA 291 form), a straight line on Q^1.85 paper.

export interface FlowTest { static: number; residual: number; flow: number }

export function availablePressure(test: FlowTest, flowGpm: number): number {
  return test.static - (test.static - test.residual) * (Math.max(0, flowGpm) / test.flow) ** 1.85;
}
