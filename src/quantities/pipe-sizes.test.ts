// Pipe size labels as designers write them, and the inside diameters of Schedule 10/40 steel pipe
// against ASME B36.10 dimensions (confirmed: 1, 1-1/4, 1-1/2, 2, 4 in Schedule 40).

import { describe, expect, it } from 'vitest';
import { INSIDE_DIAMETER, normaliseSize, parseSizeLabel } from './pipe-sizes.js';

describe('parseSizeLabel', () => {
  it.each([
    ['1"', '1'],
    ['1-1/4"', '1-1/4'],
    ['1 1/4"', '1-1/4'],
    ['2\u00bd"', '2-1/2'],
    ['1\u00bc"', '1-1/4'],
    ['3/4"', '3/4'],
    ['DN32', '1-1/4'],
    ['DN 50', '2'],
    ['32mm', '1-1/4'],
    ['65 mm', '2-1/2'],
    ['\u00d825mm', '1'],
    ['1.5"', '1-1/2'],
    ["4''", '4'],
  ])('%s → %s', (text, size) => expect(parseSizeLabel(text)).toBe(size));
  it.each(['HEAD', '12', 'DN33', '7"', 'ROOM 101', '1/3"'])('%s is not a size', (text) => expect(parseSizeLabel(text)).toBeNull());
});

describe('inside diameters', () => {
  it('Schedule 40 from ASME B36.10: 1 → 1.049, 1-1/4 → 1.380, 1-1/2 → 1.610, 2 → 2.067, 4 → 4.026 in (confirmed)', () => {
    expect([
      INSIDE_DIAMETER['40']['1'],
      INSIDE_DIAMETER['40']['1-1/4'],
      INSIDE_DIAMETER['40']['1-1/2'],
      INSIDE_DIAMETER['40']['2'],
      INSIDE_DIAMETER['40']['4'],
    ]).toEqual([1.049, 1.38, 1.61, 2.067, 4.026]);
  });
  it('Schedule 10 is OD − 2·wall from ASME B36.19: 1 in 1.315 − 2·0.109 = 1.097; 2 in 2.375 − 2·0.109 = 2.157', () => {
    expect(INSIDE_DIAMETER['10']['1']).toBeCloseTo(1.315 - 2 * 0.109, 6);
    expect(INSIDE_DIAMETER['10']['2']).toBeCloseTo(2.375 - 2 * 0.109, 6);
  });
  it('normalises configured default sizes', () => {
    expect(normaliseSize('1')).toBe('1');
    expect(normaliseSize('1.25')).toBe('1-1/4');
    expect(normaliseSize('DN40')).toBe('1-1/2');
    expect(normaliseSize('11')).toBeNull();
  });
});
