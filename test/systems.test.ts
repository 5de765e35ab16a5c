// Whole buildings: each riser feeds its own system, searched and calculated on its own; a part no riser feeds is
// an error that stops nothing else; a layout without piping is checked for its heads. Check values: two identical
// rooms must give each system exactly the figures one room alone gives (the systems do not share water).

import { describe, expect, it } from 'vitest';
import { layoutDxf } from '../src/demo/generated-layout.js';
import { checkLayout, checkText, findingsOf, layoutWith } from './support/check.js';

const room = { s: 12, l: 10, heads: 6, lines: 4 };
const config = { design: { density: 0.2, area: 1500 }, supply: { static: 90, residual: 70, flow: 1000 } };

/** The generated text without its n-th riser symbol (an INSERT on FP-SOURCE, up to the next entity). */
function withoutRiser(text: string, n: number): string {
  let seen = 0;
  return text.replace(/ {2}0\nINSERT\n[\s\S]*?(?= {2}0\n)/g, (entity) =>
    /\n {2}8\nFP-SOURCE\n/.test(entity) && seen++ === n ? '' : entity,
  );
}

describe('several systems', () => {
  const one = checkLayout(room, config);
  const two = checkLayout({ ...room, rooms: 2 }, config);
  const demandOf = (r: typeof one, system: string) =>
    r.design.areas.find((a) => a.rank === 'most-demanding' && a.system === system)!.hydraulics!;

  it('two rooms with a riser each are two systems, each searched: a most demanding area and a runner-up apiece', () => {
    expect(two.network.systems).toHaveLength(2);
    expect(two.report.summary.systems).toBe(2);
    const ids = two.network.systems.map((s) => s.id);
    expect(ids).toEqual(two.plan.sources.map((s) => s.handle));
    for (const id of ids) {
      expect(two.report.designAreas.filter((a) => a.system === id).map((a) => a.rank)).toEqual(['most-demanding', 'runner-up']);
    }
    expect(findingsOf(two, 'network-disconnected')).toEqual([]);
    expect(findingsOf(two, 'network-topology')).toHaveLength(2);
  });

  it("each system's most demanding area has the figures of the same room alone", () => {
    const alone = demandOf(one, one.network.systems[0]!.id);
    for (const s of two.network.systems) {
      const h = demandOf(two, s.id);
      expect(h.sourcePressure).toBeCloseTo(alone.sourcePressure, 6);
      expect(h.sourceFlow).toBeCloseTo(alone.sourceFlow, 6);
      expect(h.margin!).toBeCloseTo(alone.margin!, 6);
    }
  });

  it('a room whose riser is missing: its heads are an error, the other system is still calculated', () => {
    const r = checkText(withoutRiser(layoutDxf({ ...room, rooms: 2 }), 1), config);
    expect(r.network.systems).toHaveLength(1);
    const lost = findingsOf(r, 'network-disconnected');
    expect(lost).toHaveLength(1);
    expect(lost[0]!.severity).toBe('error');
    expect(lost[0]!.measured).toBe(24);
    expect(demandOf(r, r.network.systems[0]!.id).sourcePressure).toBeCloseTo(demandOf(one, one.network.systems[0]!.id).sourcePressure, 6);
    expect(r.report.summary.pass).toBe(false);
  });

  it('a second riser on the same piping: one system, calculated from the first, with a warning', () => {
    // the feed main runs from the riser at (-8, 20) to the cross main at x = 1; a second riser at (-3, 20)
    const extra = `  0\nINSERT\n  8\nFP-SOURCE\n  2\nRISER\n 10\n${-3 * 12}\n 20\n${20 * 12}\n 30\n0\n`;
    const r = checkText(layoutWith(room, extra), config);
    expect(r.network.systems).toHaveLength(1);
    const shared = findingsOf(r, 'source-unattached');
    expect(shared).toHaveLength(1);
    expect(shared[0]!.severity).toBe('warning');
    expect(shared[0]!.params).toEqual({ kind: 'shared', system: r.network.systems[0]!.id });
  });
});

describe('a layout without piping yet', () => {
  const r = checkLayout({ ...room, noPipes: true }, config);

  it('is checked for its heads: coverage of every head, no hydraulics, one warning saying why, exit by findings', () => {
    expect(r.report.heads.every((h) => h.coverage.area === 120)).toBe(true);
    expect(r.design.areas).toEqual([]);
    expect(findingsOf(r, 'hydraulics-not-evaluated')).toHaveLength(1);
    expect(r.report.summary.errors).toBe(0);
    expect(r.report.summary.pass).toBe(true);
  });

  it('finds a head too far from the wall as on a piped drawing', () => {
    const piped = checkLayout({ ...room, wallAlong: 8 }, config);
    const bare = checkLayout({ ...room, wallAlong: 8, noPipes: true }, config);
    const walls = (x: typeof r) =>
      findingsOf(x, 'wall-distance-max')
        .map((f) => (f.params as { head: string }).head)
        .sort();
    expect(walls(bare)).toEqual(walls(piped));
    expect(walls(bare)).toHaveLength(8);
  });
});
