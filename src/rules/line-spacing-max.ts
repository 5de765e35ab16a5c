// Rule line-spacing-max: distance between adjacent branch lines (measured at each head, perpendicular to
// its line) must not exceed the hazard's maximum spacing; reported once per pair of lines.

import { isStandardSpray } from './standard-heads.js';
import { finding, type Rule } from './types.js';

export const lineSpacingMax: Rule = {
  meta: { id: 'line-spacing-max', title: 'Spacing between branch lines', severity: 'error', reference: 'see limits.ts' },
  check({ plan, coverage, limits, fmt }) {
    const worst = new Map<string, { d: number; handle: string; at: { x: number; y: number } }>();
    for (const h of plan.heads.filter(isStandardSpray)) {
      const c = coverage.get(h.id);
      const left = c?.lineAcross[0];
      if (!c || left === null || left === undefined || left <= limits.maxSpacing + 1e-6) continue;
      const prev = worst.get(c.branchLine);
      if (!prev || left > prev.d) worst.set(c.branchLine, { d: left, handle: h.handle, at: h.position });
    }
    return [...worst.entries()].map(([line, w]) => finding(this.meta, {
      message: `branch line ${line} is ${fmt.length(w.d)} from the next line, over the ${fmt.length(limits.maxSpacing)} allowed`,
      handles: [w.handle], at: w.at, measured: w.d, limit: limits.maxSpacing, quantity: 'length', reference: limits.sources.maxSpacing,
    }));
  },
};
