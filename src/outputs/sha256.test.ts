// The report's script hash: our SHA-256 against Node's OpenSSL (node:crypto) and the FIPS 180-4 example values
// ("abc" → ba7816bf…, the empty text → e3b0c442…).

import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { sha256, sha256Base64 } from './sha256.js';

const hex = (b: Uint8Array) => [...b].map((x) => x.toString(16).padStart(2, '0')).join('');

describe('sha256', () => {
  it('the FIPS 180-4 examples', () => {
    expect(hex(sha256(new TextEncoder().encode('abc')))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(hex(sha256(new Uint8Array()))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });
  it.each([55, 56, 63, 64, 65, 1000, 100_003])('agrees with OpenSSL on %i bytes (padding across block edges)', (n) => {
    const text = `${Array.from({ length: n }, (_, i) => String.fromCharCode(32 + ((i * 31) % 90))).join('')}ü`;
    expect(sha256Base64(text)).toBe(createHash('sha256').update(text, 'utf8').digest('base64'));
  });
});
