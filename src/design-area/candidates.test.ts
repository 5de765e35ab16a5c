// The heads any candidate of a search flows, found without the groups' unions, against the unions themselves:
// the same heads in the same order, whatever the groups share (whole lines, next lines, heads on two lines).

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { headsOfAnyGroup, unionOf, type CandidateGroup } from './candidates.js';

describe('headsOfAnyGroup', () => {
  it("lists every head of the groups' unions once, in their order (property, against the unions)", () => {
    // Lines of head ids drawn from a small pool, so that a head can sit on two lines and in a base too; groups
    // share their base and next-line arrays as the search's do (common practice, no source).
    const id = fc.integer({ min: 0, max: 30 }).map((n) => `H${n}`);
    const world = fc.record({
      lines: fc.array(fc.array(id, { maxLength: 12 }), { minLength: 1, maxLength: 5 }),
      bases: fc.array(fc.array(id, { maxLength: 10 }), { minLength: 1, maxLength: 4 }),
      picks: fc.array(
        fc.record({
          base: fc.nat(),
          line: fc.option(fc.nat(), { nil: null }),
          first: fc.nat({ max: 13 }),
          span: fc.nat({ max: 13 }),
          size: fc.integer({ min: 1, max: 5 }),
        }),
        { maxLength: 25 },
      ),
    });
    fc.assert(
      fc.property(world, ({ lines, bases, picks }) => {
        const groups: CandidateGroup[] = picks.map((p) => {
          const heads = p.line === null ? null : lines[p.line % lines.length]!;
          return {
            base: bases[p.base % bases.length]!,
            lines: [],
            next: heads && { line: 'L', heads, first: p.first, last: p.first + p.span, size: p.size },
          };
        });
        expect(headsOfAnyGroup(groups)).toEqual([...new Set(groups.flatMap(unionOf))]);
      }),
    );
  });

  it('lists nothing for no groups, and a lone start its whole lines (worked out by hand: common practice, no source)', () => {
    expect(headsOfAnyGroup([])).toEqual([]);
    expect(headsOfAnyGroup([{ base: ['A', 'B'], lines: ['L1'], next: null }])).toEqual(['A', 'B']);
    const line = ['C', 'D', 'E', 'F'];
    const groups: CandidateGroup[] = [
      { base: ['A'], lines: ['L1'], next: { line: 'L2', heads: line, first: 2, last: 3, size: 1 } },
      { base: ['A'], lines: ['L1'], next: { line: 'L2', heads: line, first: 0, last: 0, size: 2 } },
    ];
    expect(headsOfAnyGroup(groups)).toEqual(['A', 'E', 'F', 'C', 'D']);
  });
});
