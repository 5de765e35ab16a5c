// The shape of the code, checked: folders of src/ import only folders at their level of the pipeline or below
// (so no folder imports one that imports it back), and only the edges touch Node's own modules, so that the core
// builds for the browser unchanged. Module names are read from the import lines of every non-test source file.

import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';

/**
 * Each folder's level, lowest first: shared helpers, the config and the hazard tables, then the stages in the order
 * `check` runs them, then what composes and presents them, then the edges with I/O.
 */
const LEVEL: Record<string, number> = {
  'input-error.ts': 0,
  'arrays.ts': 0,
  'version.ts': 0,
  geometry: 0,
  quantities: 0,
  config: 1,
  basis: 2,
  read: 3,
  network: 4,
  zones: 4,
  coverage: 5,
  hydraulics: 5,
  'design-area': 6,
  rules: 7,
  outputs: 8,
  check: 9,
  compare: 9,
  demo: 9,
  web: 10,
  io: 10,
  batch: 11,
  serve: 11,
  cli: 12,
};
/** The folders that may touch files, processes and threads (`node:*`); web is the page, its own edge. */
const EDGES = new Set(['io', 'cli', 'batch', 'serve']);

function sources(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) return sources(p);
    return /\.ts$/.test(name) && !/\.test\.ts$/.test(name) ? [p] : [];
  });
}

/** The top-level part of src/ a file belongs to: its folder, or the file itself at the top. */
const unitOf = (file: string) => relative('src', file).split('/')[0]!;

const imports = sources('src').map((file) => {
  const text = readFileSync(file, 'utf8');
  const specs = [
    ...text.matchAll(/^\s*(?:import|export)[^'"]*?from\s+'([^']+)'/gm),
    ...text.matchAll(/^\s*import\s+'([^']+)'/gm),
    ...text.matchAll(/import\('([^']+)'\)/g),
  ].map((m) => m[1]!);
  return { file, unit: unitOf(file), specs };
});

describe('the shape of src/', () => {
  it('every folder and top-level module has a level', () => {
    const units = [...new Set(imports.map((i) => i.unit))].sort();
    expect(units.filter((u) => LEVEL[u] === undefined)).toEqual([]);
  });

  it('a folder imports only folders at its level or below, and no two folders import each other', () => {
    const wrong: string[] = [];
    const edges = new Set<string>();
    for (const { file, unit, specs } of imports) {
      for (const spec of specs.filter((s) => s.startsWith('.'))) {
        const target = unitOf(relative('.', join(file, '..', spec)));
        if (target === unit) continue;
        edges.add(`${unit}->${target}`);
        if (LEVEL[target]! > LEVEL[unit]!) wrong.push(`${file} imports ${spec} (${target} is above ${unit})`);
      }
    }
    expect(wrong).toEqual([]);
    const cycles = [...edges].filter((e) => {
      const [a, b] = e.split('->');
      return edges.has(`${b}->${a}`);
    });
    expect(cycles).toEqual([]);
  });

  it('only the edges import node:*; the core builds for the browser', () => {
    const wrong = imports.filter((i) => !EDGES.has(i.unit) && i.specs.some((s) => s.startsWith('node:'))).map((i) => i.file);
    expect(wrong).toEqual([]);
  });

  it('each module opens with the comment saying what it is for', () => {
    const bare = sources('src').filter((f) => !/^\/\/ \S/.test(readFileSync(f, 'utf8')));
    expect(bare).toEqual([]);
  });
});
