// A group's value read as a number straight from its bytes equals what JavaScript's own Number() makes of its
// text, bit for bit (ECMAScript's string-to-number conversion is the reference), on every kind of value a DXF holds.

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { GroupCursor, latin1 } from './groups.js';

/** The value of a one-group file "10 / value", as the cursor reads it. */
function readValue(text: string): { number: number; text: string } {
  const c = new GroupCursor(new TextEncoder().encode(` 10\n${text}\n`));
  c.next();
  return { number: c.number(), text: c.latin1() };
}

describe('group values as numbers', () => {
  it('plain decimals, signs, leading and trailing points, and what is no plain decimal', () => {
    const cases = [
      '0',
      '-0',
      '+5',
      '12.5',
      '-.5',
      '5.',
      '.',
      '-',
      '',
      '007.250',
      '1e5',
      '-2.5E-3',
      '0x1A',
      'Infinity',
      'NaN',
      '1.2.3',
      '1,5',
    ];
    cases.push('123456789012345678901', '0.1234567890123456789', '9007199254740993', '1.00000000000000000000001');
    for (const text of cases) expect(Object.is(readValue(text).number, Number(text)), text).toBe(true);
  });

  it('random decimals of up to 25 digits and any number of decimals read as Number() reads them', () => {
    fc.assert(
      fc.property(
        fc.constantFrom('', '-', '+'),
        fc.stringMatching(/^[0-9]{0,14}$/),
        fc.boolean(),
        fc.stringMatching(/^[0-9]{0,25}$/),
        (sign, whole, point, fraction) => {
          const text = `${sign}${whole}${point ? '.' : ''}${point ? fraction : ''}`;
          expect(Object.is(readValue(text).number, Number(text)), text).toBe(true);
        },
      ),
      { numRuns: 5000 },
    );
  });

  it('any double written out by JavaScript reads back to itself', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(Object.is(readValue(String(x)).number, Number(String(x)))).toBe(true);
        expect(Object.is(readValue(x.toFixed(6)).number, Number(x.toFixed(6)))).toBe(true);
      }),
      { numRuns: 5000 },
    );
  });

  it('text short and long reads byte for byte as Latin-1', () => {
    const long = `${'x'.repeat(5000)}é`;
    const bytes = Uint8Array.from(long, (ch) => ch.charCodeAt(0));
    expect(latin1(bytes, 0, bytes.length)).toBe(long);
    expect(latin1(bytes, 4990, 5001)).toBe(long.slice(4990));
    expect(readValue('HEADS-1').text).toBe('HEADS-1');
  });
});
