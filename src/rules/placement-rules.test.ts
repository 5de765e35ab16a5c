// head-unattached, head-outside-room and head-type-unchecked (common practice, no source): heads that
// cannot be fed or checked are named; special heads are never checked against the standard-spray table.

import { describe, expect, it } from 'vitest';
import { checkLayout, findingsOf } from '../../test/support/check.js';

describe('placement rules', () => {
  it('a head off every pipe and outside the room is reported by both rules', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 3, lines: 2, extraHeads: [{ x: 60, y: 40 }] });
    const lone = r.plan.heads.find((h) => h.position.x === 60 * 12 / 12)!;
    expect(findingsOf(r, 'head-unattached').map((f) => f.handles)).toEqual([[lone.handle]]);
    expect(findingsOf(r, 'head-outside-room').map((f) => f.handles)).toEqual([[lone.handle]]);
    expect(r.report.summary.pass).toBe(false);
  });
  it('sidewall heads are not checked against the standard-spray table, and say so', () => {
    const r = checkLayout({ s: 20, l: 20, heads: 2, lines: 2, headAttribs: [{ tag: 'TYPE', value: 'SW' }] });
    expect(findingsOf(r, 'head-type-unchecked')).toHaveLength(4);
    expect(findingsOf(r, 'protection-area')).toEqual([]);
    expect(findingsOf(r, 'head-spacing-max')).toEqual([]);
  });
  it('a clean layout has no error and no warning', () => {
    const r = checkLayout({ s: 12, l: 10, heads: 4, lines: 3 });
    expect(r.findings.filter((f) => f.severity !== 'info')).toEqual([]);
    expect(r.report.summary.pass).toBe(true);
  });
});
