// Text values to plain text: MTEXT formatting codes, stacked fractions, `\U+` escapes and `%%` specials,
// as the DXF reference defines them (MTEXT inline codes; TEXT control codes).

import { describe, expect, it } from 'vitest';
import { decodeUnicodeEscapes, plainMText, plainText } from './text-codes.js';

describe('text codes', () => {
  it('decodes \\U+ escapes (R2000-R2004 non-ASCII)', () => expect(decodeUnicodeEscapes('A-W\\U+00C4ND')).toBe('A-WÄND'));
  it('replaces %% specials: %%c Ø-sign, %%d degree, %%p plus-minus, %%% percent', () => {
    expect(plainText('%%c25 90%%d %%p1 5%%%')).toBe('\u230025 90\u00b0 \u00b11 5%');
  });
  it('strips MTEXT font, height and colour groups', () => {
    expect(plainMText('{\\fArial|b1|i0|c0|p34;1-1/4"}')).toBe('1-1/4"');
    expect(plainMText('\\H2.5x;\\C1;2"')).toBe('2"');
  });
  it('turns \\P into a line break and keeps escaped braces and backslashes', () => {
    expect(plainMText('a\\Pb \\{x\\} \\\\')).toBe('a\nb {x} \\');
  });
  it('writes stacked fractions as a/b, after a whole number as a mixed number', () => {
    expect(plainMText('1\\S1/4;"')).toBe('1 1/4"');
    expect(plainMText('\\S3#4;"')).toBe('3/4"');
  });
  it('drops underline and overline toggles', () => expect(plainMText('\\L2"\\l')).toBe('2"'));
});
