// The whole pipeline as one pure function: drawing bytes and settings in, every stage's result and the
// report out. No file or process access: the CLI, batch workers and the browser all call this.

import type { Settings } from '../config/settings.js';
import { evaluateDesignAreas } from '../design-area/evaluate.js';
import { buildNetwork } from '../network/build-network.js';
import { buildReport } from '../outputs/json-report.js';
import type { Reviewed } from '../outputs/reviewed.js';
import type { UnitSystem } from '../quantities/convert.js';
import { fail } from '../input-error.js';
import { planFromDrawing, type Plan } from '../read/plan.js';
import { readDrawing } from '../read/read-drawing.js';
import type { Drawing, DrawingFacts } from '../read/types.js';
import { computeCoverage } from '../coverage/coverage.js';
import { zoneHeads } from '../zones/zones.js';
import { formatterFor } from '../quantities/format.js';
import { messageOf } from '../rules/messages.js';
import { runRules } from '../rules/registry.js';
import { indexWalls } from '../coverage/walls.js';

export interface CheckInput {
  bytes: Uint8Array;
  /** Name of the drawing as the report states it. */
  fileName: string;
  /** SHA-256 of the file as given, hex (computed by the caller: Node crypto or Web Crypto). */
  sha256: string;
  /** The version tag of a DWG drawing whose DXF conversion `bytes` is (null or absent: the file is DXF). */
  dwgVersion?: string | null;
  settings: Settings;
  reportUnits: UnitSystem;
  /** Stop (an input error) where no hydraulic calculation can be made, instead of a warning. */
  requireHydraulics?: boolean;
  /** Called after each stage with its name and duration in ms (for the benchmark). */
  onStage?: (stage: string, ms: number) => void;
  /**
   * Called inside the design-area stage where most of what it allocated so far is garbage (a search's model of every
   * head just built): the command collects there on a large heap.
   */
  onGarbage?: () => void;
}

/** The check's result: the drawing reviewed, as every output takes it. */
export type CheckResult = Reviewed;

export function runCheck(input: CheckInput): CheckResult {
  const { settings } = input;
  let last = performance.now();
  const stage = <T>(name: string, value: T): T => {
    const now = performance.now();
    input.onStage?.(name, now - last);
    last = now;
    return value;
  };
  const { drawing, plan } = planOf(input, stage);
  if (plan.heads.length === 0) fail(noHeads(drawing, settings));
  const network = stage('network', buildNetwork(plan, settings));
  const walls = indexWalls(plan.rooms, plan.walls);
  const coverage = stage('coverage', computeCoverage(plan.heads, network, walls));
  const zoning = zoneHeads(plan, settings);
  const design = stage('design-area', evaluateDesignAreas(plan, network, coverage, zoning, settings, walls.roomOf, input.onGarbage));
  const findings = stage('rules', runRules({ drawing, plan, network, settings, zoning, coverage, walls, design }));
  const unevaluated = findings.find((f) => f.rule === 'hydraulics-not-evaluated');
  if (input.requireHydraulics && unevaluated) fail(`${messageOf(unevaluated, formatterFor(input.reportUnits))} (--require-hydraulics)`);
  const report = stage('report', buildReport({ ...input, drawing, plan, network, coverage, zoning, design, findings }));
  return {
    bytes: input.bytes,
    fileName: input.fileName,
    settings,
    reportUnits: input.reportUnits,
    drawing,
    plan,
    network,
    coverage,
    zoning,
    design,
    findings,
    report,
  };
}

/** Why no head was found, naming what was seen and the config keys to set: one line. */
function noHeads(drawing: DrawingFacts, settings: Settings): string {
  const { heads } = drawing.roles;
  const keys = 'set "layers.heads" and "headBlocks" in the config (headcheck layers lists every layer)';
  if (heads.layers.length) {
    const placed = drawing.layers
      .filter((l) => heads.layers.includes(l.name))
      .flatMap((l) => Object.entries(l.blockRefs).map(([b, n]) => `${b} ×${n}`));
    return (
      `no sprinkler heads found: the head layers (${heads.layers.join(', ')}) hold no block matching headBlocks ${JSON.stringify(settings.headBlocks)}` +
      ` nor circles${placed.length ? `; blocks there: ${placed.slice(0, 5).join(', ')}` : ''}; ${keys}`
    );
  }
  const seen = drawing.headCandidates
    .slice(0, 3)
    .map((c) => `${c.layer}: ${c.block === null ? 'circles' : c.block} ×${c.count} (${c.why})`);
  return `no sprinkler heads found: no layer holds symbols that look like heads${seen.length ? `; seen: ${seen.join('; ')}` : ' (no layer holds three or more alike symbols)'}; ${keys}`;
}

/**
 * Reads the drawing and builds its plan. A function of its own so that the drawing's raw geometry (block
 * references, linework, texts) is garbage once it returns: the plan keeps what the later stages use.
 */
function planOf(input: CheckInput, stage: <T>(name: string, value: T) => T): { drawing: DrawingFacts; plan: Plan } {
  const { settings } = input;
  const read: Drawing = stage(
    'read',
    readDrawing(input.bytes, {
      layers: settings.layers,
      limits: settings.inputLimits,
      ...(settings.units ? { units: settings.units } : {}),
    }),
  );
  const plan = stage('plan', planFromDrawing(read, settings));
  const { version, units, unitsFrom, headerUnits, encoding, handseed, entityHandles, layers, roles, headCandidates } = read;
  return { drawing: { version, units, unitsFrom, headerUnits, encoding, handseed, entityHandles, layers, roles, headCandidates }, plan };
}
