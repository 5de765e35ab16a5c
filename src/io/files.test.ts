// Atomic writes of the outputs: all files or none, each made only when its turn comes, pieces written in
// order; and an input read as a view of the file's bytes.

import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import { describe, expect, it } from 'vitest';
import { InputError } from '../input-error.js';
import { readInputFile, writeAllAtomically } from './files.js';

const folder = () => mkdtempSync(join(tmpdir(), 'headcheck-files-'));
const ascii = (s: string) => new TextEncoder().encode(s);

describe('writeAllAtomically', () => {
  it('writes text as UTF-8, bytes as they are, and pieces one after another', async () => {
    const dir = folder();
    await writeAllAtomically([
      { path: join(dir, 'a.txt'), data: 'Ø 2½"' },
      { path: join(dir, 'b.dxf'), data: () => [ascii('  0\n'), ascii('SECTION\n'), new Uint8Array(0), ascii('  0\nEOF\n')] },
    ]);
    // The expected bytes are UTF-8 of the text (Unicode: Ø U+00D8 is C3 98, ½ U+00BD is C2 BD).
    expect([...readFileSync(join(dir, 'a.txt'))]).toEqual([0xc3, 0x98, 0x20, 0x32, 0xc2, 0xbd, 0x22]);
    expect(readFileSync(join(dir, 'b.dxf'), 'latin1')).toBe('  0\nSECTION\n  0\nEOF\n');
    expect(readdirSync(dir).sort()).toEqual(['a.txt', 'b.dxf']);
  });

  it('writes a long text in pieces without splitting a character (a surrogate pair across a piece boundary)', async () => {
    const dir = folder();
    // U+1F600 is the surrogate pair D83D DE00; placed so that its first half ends the first 2^20-character piece.
    const text = `${'a'.repeat(2 ** 20 - 1)}\u{1F600}${'é'.repeat(3000)}`;
    await writeAllAtomically([{ path: join(dir, 'long.json'), data: text }]);
    // Expected: the whole text encoded at once by Node's own UTF-8 encoder.
    expect(Buffer.compare(readFileSync(join(dir, 'long.json')), Buffer.from(text, 'utf8'))).toBe(0);
  });

  it('leaves no file, finished or temporary, when making a later output fails, and passes its error on', async () => {
    const dir = folder();
    const made: string[] = [];
    await expect(
      writeAllAtomically([
        {
          path: join(dir, 'report.json'),
          data: () => {
            made.push('json');
            return '{}\n';
          },
        },
        {
          path: join(dir, 'plan.dxf'),
          data: () => {
            throw new InputError('the drawing has no ENTITIES section');
          },
        },
        {
          path: join(dir, 'report.html'),
          data: () => {
            made.push('html');
            return '<p>';
          },
        },
      ]),
    ).rejects.toThrow(/^the drawing has no ENTITIES section$/);
    expect(made).toEqual(['json']); // the HTML was never made
    expect(readdirSync(dir)).toEqual([]);
  });

  it('holds an output no longer once it is written: it is garbage when the next is made', async () => {
    setFlagsFromString('--expose-gc');
    const gc = runInNewContext('gc') as () => void;
    const dir = folder();
    let first: WeakRef<Uint8Array> | null = null;
    let firstAlive: boolean | null = null;
    await writeAllAtomically([
      {
        path: join(dir, 'plan.dxf'),
        data: () => {
          const bytes = new Uint8Array(1 << 20).fill(0x20);
          first = new WeakRef(bytes);
          return bytes;
        },
      },
      {
        path: join(dir, 'report.json'),
        data: () => {
          gc();
          firstAlive = first?.deref() !== undefined;
          return '{}\n';
        },
      },
    ]);
    // A full collection frees what nothing reaches (common practice, no source): nothing may still hold the bytes.
    expect(readFileSync(join(dir, 'plan.dxf')).length).toBe(1 << 20);
    expect(firstAlive).toBe(false);
  });
});

describe('readInputFile', () => {
  it('reads the whole file, the same bytes', () => {
    const dir = folder();
    const content = new Uint8Array(100_000).map((_, i) => (i * 7) & 0xff);
    writeFileSync(join(dir, 'big.dxf'), content);
    const read = readInputFile(join(dir, 'big.dxf'), 1);
    expect(read.length).toBe(content.length);
    expect(Buffer.compare(Buffer.from(read), Buffer.from(content))).toBe(0);
  });
});
