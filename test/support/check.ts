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

/** A generated layout (inches) with more entities added to its model space, given as DXF group text. */
export const layoutWith = (spec: LayoutSpec, extra: string): string => {
  const text = layoutDxf(spec);
  const at = text.lastIndexOf('  0\nENDSEC\n  0\nEOF');
  return text.slice(0, at) + extra + text.slice(at);
};

/** A LINE on `layer` from (x1, y1) to (x2, y2) feet, as DXF groups in inches. */
export const lineGroups = (layer: string, x1: number, y1: number, x2: number, y2: number): string =>
  `  0\nLINE\n  8\n${layer}\n 10\n${x1 * 12}\n 20\n${y1 * 12}\n 11\n${x2 * 12}\n 21\n${y2 * 12}\n`;

/** A TEXT on `layer` at (x, y) feet, 6 in high. */
export const textGroups = (layer: string, x: number, y: number, value: string): string =>
  `  0\nTEXT\n  8\n${layer}\n 10\n${x * 12}\n 20\n${y * 12}\n 40\n6\n  1\n${value}\n`;
