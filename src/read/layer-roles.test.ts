// Which texts the reader keeps as possible size labels: every text the network reads as a pipe size passes
// the loose test (checked on the label formats of the contract and on random label-like texts), notes do not.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseSizeLabel } from '../quantities/pipe-sizes.js';
import { couldBeSizeLabel } from './layer-roles.js';

describe('couldBeSizeLabel', () => {
  it.each(['1"', '1-1/4"', '1 1/4"', '2\u00bd"', '2\\U+00BD"', 'DN32', 'DN 50', '32mm', '65 mm', '\u00d825mm', '1.5"', "4''", '1.25 in', '{\\fArial|b0;1-1/2"}'])(
    '%s may be a size label', (text) => expect(couldBeSizeLabel(text)).toBe(true),
  );

  it.each(['RACK 123', '\u00d8 25 \u2013 Hinweis', 'ROOM 101', 'Mechanical', 'Level 2'])('%s is not read as one', (text) => {
    expect(couldBeSizeLabel(text)).toBe(false);
  });

  it('passes every text that reads as a pipe size (random label-like texts)', () => {
    const part = fc.constantFrom('1', '2', '3', '4', '25', '32', '50', '65', '/', '-', ' ', '.', '"', "''", 'in', 'mm', 'DN', '\u00bd', '\u00bc', '\u00d8', 'x');
    fc.assert(fc.property(fc.array(part, { minLength: 1, maxLength: 6 }), (parts) => {
      const text = parts.join('');
      if (parseSizeLabel(text)) expect(couldBeSizeLabel(text)).toBe(true);
    }), { numRuns: 2000 });
  });
});
