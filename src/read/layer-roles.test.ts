// Which texts the reader keeps as possible size labels: every text the network reads as a pipe size passes
// the loose test (checked on the label formats of the contract and on random label-like texts), notes do not.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseSizeLabel } from '../quantities/pipe-sizes.js';
import type { Evidence } from './evidence.js';
import { assignLayerRoles, couldBeSizeLabel } from './layer-roles.js';

describe('couldBeSizeLabel', () => {
  it.each([
    '1"',
    '1-1/4"',
    '1 1/4"',
    '2\u00bd"',
    '2\\U+00BD"',
    'DN32',
    'DN 50',
    '32mm',
    '65 mm',
    '\u00d825mm',
    '1.5"',
    "4''",
    '1.25 in',
    '{\\fArial|b0;1-1/2"}',
  ])('%s may be a size label', (text) => expect(couldBeSizeLabel(text)).toBe(true));

  it.each(['RACK 123', '\u00d8 25 \u2013 Hinweis', 'ROOM 101', 'Mechanical', 'Level 2'])('%s is not read as one', (text) => {
    expect(couldBeSizeLabel(text)).toBe(false);
  });

  it('passes every text that reads as a pipe size (random label-like texts)', () => {
    const part = fc.constantFrom(
      '1',
      '2',
      '3',
      '4',
      '25',
      '32',
      '50',
      '65',
      '/',
      '-',
      ' ',
      '.',
      '"',
      "''",
      'in',
      'mm',
      'DN',
      '\u00bd',
      '\u00bc',
      '\u00d8',
      'x',
    );
    fc.assert(
      fc.property(fc.array(part, { minLength: 1, maxLength: 6 }), (parts) => {
        const text = parts.join('');
        if (parseSizeLabel(text)) expect(couldBeSizeLabel(text)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('the head guess weighs evidence', () => {
  const layer = (name: string, symbols: Record<string, number>, counts: Record<string, number> = {}) => ({
    name,
    counts: { INSERT: Object.values(symbols).reduce((a, b) => a + b, 0), ...counts },
    blockRefs: symbols,
    symbolRefs: symbols,
    refs: 0,
    strokes: counts['LINE'] ?? 0,
    outlines: 0,
    points: 0,
  });
  /** Blocks of given sizes (inches, the drawing's unit) and tags; linework share per layer. */
  const evidence = (
    sizes: Record<string, number>,
    tags: Record<string, string[]> = {},
    onPipes: Record<string, number> = {},
  ): Evidence => ({
    block: (name) => ({ name, size: sizes[name] ?? null, tags: tags[name] ?? [] }),
    circles: () => ({ sampled: 0, radius: null }),
    onLinework: (l) => onPipes[l] ?? 0,
  });
  const guess = (layers: ReturnType<typeof layer>[], ev: Evidence) =>
    assignLayerRoles({
      layers: [...layers, layer('P-LINES', {}, { LINE: 40 })],
      patterns: { pipes: ['P-LINES'] },
      evidence: ev,
      feetPerUnit: 1 / 12,
    });

  // Sizes: a head symbol is a few inches to about two feet across (common practice, no source).
  const cases: [string, ReturnType<typeof layer>[], Evidence, string[]][] = [
    ['chairs on a furniture layer are no heads', [layer('A-FURN', { CHAIR: 40 })], evidence({ CHAIR: 20 }), []],
    ['three 20 × 36 ft marquees are building-sized', [layer('Stages', { MARQUEE: 3 })], evidence({ MARQUEE: 432 }), []],
    ['dimension ticks are too small', [layer('DIMS', { TICK: 300 })], evidence({ TICK: 0.1 }), []],
    ['a symbol named like nothing, off the pipes, is no head', [layer('0', { SYM1: 12 })], evidence({ SYM1: 6 }), []],
    ['the same symbol sitting on the pipe linework is', [layer('0', { SYM1: 12 })], evidence({ SYM1: 6 }, {}, { '0': 0.9 }), ['0']],
    ['a K attribute makes a head of a plainly named block', [layer('M-SYMB', { S1: 20 })], evidence({ S1: 8 }, { S1: ['K'] }), ['M-SYMB']],
    [
      'heads beside chairs: the heads',
      [layer('FP-HEAD', { SPK: 12 }), layer('A-FURN', { CHAIR: 40 })],
      evidence({ SPK: 6, CHAIR: 20 }),
      ['FP-HEAD'],
    ],
  ];
  it.each(cases)('%s', (_, layers, ev, heads) => {
    const { roles, headCandidates } = guess(layers, ev);
    expect(roles.heads.layers).toEqual(heads);
    for (const c of headCandidates.filter((x) => !x.taken)) expect(c.why).not.toBe('');
  });
});
