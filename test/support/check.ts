// Runs the whole pipeline on a generated layout, for rule tests: spec and config in, result out.

import { parseSettings } from '../../src/config/settings.js';
import { runCheck, type CheckResult } from '../../src/check/run-check.js';
import type { UnitSystem } from '../../src/quantities/convert.js';
import { encode, layoutDxf, type LayoutSpec } from '../../src/demo/generated-layout.js';

export function checkText(dxf: string, config: Record<string, unknown> = {}, reportUnits: UnitSystem = 'us'): CheckResult {
  return runCheck({ bytes: encode(dxf), fileName: 'test.dxf', sha256: '0'.repeat(64), settings: parseSettings(config), reportUnits });
}

export const checkLayout = (spec: LayoutSpec, config: Record<string, unknown> = {}): CheckResult => checkText(layoutDxf(spec), config);

/** Findings of one rule. */
export const findingsOf = (r: CheckResult, rule: string) => r.findings.filter((f) => f.rule === rule);
