// Finding a batch's drawings where a folder cannot be listed: one inside is listed as skipped with the reason and
// the others are still found; the batch folder itself is refused in one line.

import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import * as fs from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { InputError } from '../input-error.js';
import { discoverDrawings } from './discover.js';

const unreadable = new Set<string>();
vi.mock('node:fs', async (original) => {
  const real = await original<typeof import('node:fs')>();
  return {
    ...real,
    readdirSync: ((path: string, options: never) => {
      if (unreadable.has(path)) throw Object.assign(new Error(`EACCES: permission denied, scandir '${path}'`), { code: 'EACCES' });
      return real.readdirSync(path, options);
    }) as typeof real.readdirSync,
  };
});

afterEach(() => unreadable.clear());

describe('discoverDrawings', () => {
  const set = mkdtempSync(join(tmpdir(), 'hc-discover-'));
  mkdirSync(join(set, 'a'));
  mkdirSync(join(set, 'b'));
  for (const f of ['a/one.dxf', 'b/two.DXF', 'three.dwg', 'notes.txt']) writeFileSync(join(set, f), '');

  it('finds the drawings of every folder, in order (the layout worked out by hand: common practice, no source)', () => {
    expect(discoverDrawings([set], join(set, 'out')).items.map((x) => x.rel)).toEqual(['a/one.dxf', 'b/two.DXF', 'three.dwg']);
    expect(fs.readdirSync(set).length).toBe(4); // the mock passes every other folder through
  });

  it('lists a folder inside that cannot be listed as skipped, and still finds the rest', () => {
    unreadable.add(join(set, 'a'));
    const { items, skipped } = discoverDrawings([set], join(set, 'out'));
    expect(items.map((x) => x.rel)).toEqual(['b/two.DXF', 'three.dwg']);
    expect(skipped).toEqual([{ file: join(set, 'a'), reason: 'a folder that cannot be read' }]);
  });

  it('refuses a batch folder that cannot be listed, naming it', () => {
    unreadable.add(set);
    expect(() => discoverDrawings([set], join(set, 'out'))).toThrow(InputError);
    expect(() => discoverDrawings([set], join(set, 'out'))).toThrow(`${set}: the folder cannot be read`);
  });
});
