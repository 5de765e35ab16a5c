// Rule line-spacing-max: distance between adjacent branch lines (measured at each head, perpendicular to its
// line) must not exceed the hazard's maximum spacing; reported once per line, at its widest.

import { isStandardSpray } from './standard-heads.js';
import type { Limits } from '../basis/limits.js';
import { basisOfHead } from '../zones/zones.js';
import { finding, type Rule } from './types.js';

export const lineSpacingMax: Rule<'line-spacing-max'> = {
  meta: {
    id: 'line-spacing-max',
    title: 'Spacing between branch lines',
    severity: 'error',
    reference: 'NFPA 13 (2019 edition), Table 10.2.4.2.1(a)-(c): 15 ft LH/OH, 12 ft EH (from memory)',
  },
  check({ plan, coverage, zoning }) {
    const worst = new Map<string, { d: number; handle: string; at: { x: number; y: number }; limits: Limits }>();
    for (const h of plan.heads.filter(isStandardSpray)) {
      const { limits } = basisOfHead(zoning, h);
      const c = coverage.get(h.id);
      const left = c?.lineAcross[0];
      if (!c || left === null || left === undefined || left <= limits.maxSpacing + 1e-6) continue;
      const prev = worst.get(c.branchLine);
      if (!prev || left > prev.d) worst.set(c.branchLine, { d: left, handle: h.handle, at: h.position, limits });
    }
    return [...worst.entries()].map(([line, w]) =>
      finding(this.meta, {
        params: { line, distance: w.d, limit: w.limits.maxSpacing },
        handles: [w.handle],
        at: w.at,
        measured: w.d,
        limit: w.limits.maxSpacing,
        quantity: 'length',
        reference: w.limits.sources.maxSpacing,
      }),
    );
  },
};
