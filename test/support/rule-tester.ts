// Tables of cases for one rule, in the manner of ESLint's RuleTester: drawings (a generated layout, or DXF text)
// with a config where the rule finds nothing, and drawings where it finds what each case states.

import { describe, expect, it } from 'vitest';
import type { LayoutSpec } from '../../src/demo/generated-layout.js';
import type { Finding, FindingKind, Rule, Severity } from '../../src/rules/types.js';
import { checkLayout, checkText } from './check.js';

export interface RuleCase {
  /** What the case shows, with the source of its check values. */
  name: string;
  layout?: LayoutSpec;
  dxf?: string;
  config?: Record<string, unknown>;
}

export interface InvalidCase<K extends FindingKind> extends RuleCase {
  /** How many findings of the rule, and what (some of) them carry. */
  count: number;
  severity?: Severity;
  measured?: number;
  limit?: number;
  params?: Partial<Finding<K>['params']>;
  /** Checks of the findings beyond the above. */
  also?: (found: Finding<K>[]) => void;
}

const findingsOf = <K extends FindingKind>(rule: Rule<K>, c: RuleCase): Finding<K>[] => {
  const r = c.dxf !== undefined ? checkText(c.dxf, c.config) : checkLayout(c.layout!, c.config);
  return r.findings.filter((f) => f.rule === rule.meta.id) as Finding<K>[];
};

/** Runs the rule's valid cases (no finding) and invalid cases (the findings stated) as a table of tests. */
export function ruleTester<K extends FindingKind>(rule: Rule<K>, cases: { valid: RuleCase[]; invalid: InvalidCase<K>[] }): void {
  describe(rule.meta.id, () => {
    it.each(cases.valid.map((c) => [c.name, c] as const))('valid: %s', (_, c) => {
      expect(findingsOf(rule, c)).toEqual([]);
    });
    it.each(cases.invalid.map((c) => [c.name, c] as const))('invalid: %s', (_, c) => {
      const found = findingsOf(rule, c);
      expect(found).toHaveLength(c.count);
      const first = found[0]!;
      if (c.severity) expect(first.severity).toBe(c.severity);
      if (c.measured !== undefined) expect(first.measured).toBeCloseTo(c.measured, 6);
      if (c.limit !== undefined) expect(first.limit).toBeCloseTo(c.limit, 6);
      if (c.params) expect(first.params).toMatchObject(c.params);
      c.also?.(found);
    });
  });
}
