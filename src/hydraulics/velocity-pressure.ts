// Normal pressure at flowing outlets (total pressure less the velocity pressure of the water running past), as
// NFPA 13 permits: where each head and each side outlet of a tee loses it, read from a solved state of the model.

import type { HydraulicModel, PipesAtNodes } from './model.js';
import type { FlowState, NetworkSolver, SolveResult } from './solver.js';

/**
 * Velocity pressure, psi, of `q` gpm in a pipe of inside diameter `d` in: Pv = v²/2g at 0.433 psi/ft with
 * v = 0.4085·q/d² ft/s, which is 0.001123·q²/d⁴ (the trade's form, from memory; a test derives it).
 */
export const velocityPressurePsi = (q: number, d: number): number => (0.001123 * q * q) / (d * d * d * d);

/** The texts that state which pressure the heads' flows use, one per choice; every report takes them from here. */
export const PRESSURE_BASIS = {
  total: 'Heads flow at the total pressure (velocity pressure not used; NFPA 13 (2016 edition), 23.4.4.10: the default).',
  normal:
    'Heads flow at the normal pressure, total less velocity pressure, as NFPA 13 (2016 edition), 23.4.4.10 permits, on branch lines ' +
    'and cross mains alike: at a head the water runs past, and where a pipe leaves a tee from the side while the water runs on along ' +
    'the tee, the velocity pressure of the pipe feeding it (the pipe upstream: flow found by iteration) is deducted; at an end head and ' +
    'where the run ends in the tee, nothing is (from memory: the standard’s explanatory annex; check it against the adopted edition). ' +
    'A searched design area is found at the total pressure, where the search’s proof holds, and calculated at the normal pressure.',
} as const;
export type PressureBasis = keyof typeof PRESSURE_BASIS;

/** What the normal pressure deducts, psi: per emitter, and per pipe at its entry from a tee, signed in the pipe's from → to sense. */
export interface NormalPressureDrops {
  emitter: Float64Array;
  pipe: Float64Array;
}

/** Flows below this, gpm, run nowhere (the solver's flows are exact to far less). */
const STILL = 1e-9;

/**
 * The deductions in state `s`. At each node: the pipes bringing water in, and those taking it on. Water runs past
 * the node when a pipe takes it on along the run of a pipe bringing it; then a head there, and each pipe leaving on
 * another run (a side outlet), lose the least velocity pressure among the feeding pipes on such a run (the least,
 * where two feed it: the smaller deduction is the safe one). Where no water runs past, nothing is deducted.
 */
export function normalPressureDrops(model: HydraulicModel, pipesAt: PipesAtNodes, s: FlowState): NormalPressureDrops {
  const emitter = new Float64Array(model.emitters.length);
  const pipe = new Float64Array(model.pipes.length);
  const emitterAt = new Int32Array(model.nodes.length).fill(-1);
  model.emitters.forEach((e, k) => {
    if (s.emitterFlow[k]! > STILL) emitterAt[e.node] = k;
  });
  pipesAt.forEach((list, v) => {
    const inflow = (k: number) => (model.pipes[k]!.to === v ? s.flow[k]! : -s.flow[k]!);
    let runPast = Infinity;
    for (const i of list) {
      if (inflow(i) <= STILL || model.pipes[i]!.run < 0) continue;
      const continues = list.some((o) => o !== i && inflow(o) < -STILL && model.pipes[o]!.run === model.pipes[i]!.run);
      if (continues) runPast = Math.min(runPast, velocityPressurePsi(inflow(i), model.pipes[i]!.diameter));
    }
    if (runPast === Infinity) return;
    if (emitterAt[v]! >= 0) emitter[emitterAt[v]!] = runPast;
    for (const o of list) {
      if (inflow(o) >= -STILL) continue;
      const run = model.pipes[o]!.run;
      const side = run >= 0 && !list.some((i) => inflow(i) > STILL && model.pipes[i]!.run === run);
      if (side) pipe[o] = model.pipes[o]!.from === v ? runPast : -runPast;
    }
  });
  return { emitter, pipe };
}

/** The deductions are repeated until they change by less than this, psi, within so many solves. */
const DROP_TOL = 1e-9;
const MAX_DROP_ROUNDS = 50;

/**
 * A solve at source pressure P with the heads at the normal pressure. The deductions depend on the flows and the
 * flows on the deductions: solved, deductions read from the flows, solved again, until they hold (the first round
 * warm from the solver's last deductions). The solver keeps the deductions the result was solved with.
 */
export function solveAtNormalPressure(
  solver: NetworkSolver,
  pipesAt: PipesAtNodes,
  P: number,
  open?: Int32Array,
): { state: SolveResult; solves: number; iterations: number } {
  let iterations = 0;
  for (let round = 1; round <= MAX_DROP_ROUNDS; round++) {
    const state = solver.solve(P, open);
    iterations += state.iterations;
    const drops = normalPressureDrops(solver.model, pipesAt, solver.expand(state));
    if (dropChange(drops, solver.drops) <= DROP_TOL) return { state, solves: round, iterations };
    solver.drops = drops;
  }
  throw new Error(`the velocity pressures did not settle in ${MAX_DROP_ROUNDS} solves`);
}

/** The largest difference between two sets of deductions, psi (none: all zeros). */
function dropChange(a: NormalPressureDrops, b: NormalPressureDrops | null): number {
  let most = 0;
  for (let k = 0; k < a.emitter.length; k++) most = Math.max(most, Math.abs(a.emitter[k]! - (b?.emitter[k] ?? 0)));
  for (let k = 0; k < a.pipe.length; k++) most = Math.max(most, Math.abs(a.pipe[k]! - (b?.pipe[k] ?? 0)));
  return most;
}
