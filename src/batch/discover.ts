// Finds the drawings of a batch: DXF files in folders (recursively, extension in any case) and files named
// directly, each with the root it was found under, in a stable order; and each drawing's config file.

import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, extname, join, relative, resolve, sep } from 'node:path';
import { createHash } from 'node:crypto';
import { InputError } from '../input-error.js';

export interface BatchItem {
  /** Path as found (for messages and reports). */
  file: string;
  /** Path relative to its root, with / separators. */
  rel: string;
  root: string;
  /** Output base name: readable, and unique even for same-named files in two folders. */
  name: string;
}

export function discoverDrawings(inputs: string[], outDir: string): BatchItem[] {
  const out = resolve(outDir);
  const items: BatchItem[] = [];
  const seen = new Set<string>();
  const add = (file: string, root: string) => {
    const abs = resolve(file);
    if (seen.has(abs)) return;
    seen.add(abs);
    const rel = relative(root, abs).split(sep).join('/');
    items.push({ file, rel, root, name: outputName(rel, abs) });
  };
  for (const input of inputs) {
    if (!existsSync(input)) throw new InputError(`${input}: no such file or folder`);
    if (statSync(input).isDirectory()) {
      for (const f of walk(input, out)) add(f, resolve(input));
    } else {
      add(input, resolve(dirname(input)));
    }
  }
  return items.sort((a, b) => (a.root === b.root ? a.rel.localeCompare(b.rel) : a.root.localeCompare(b.root)));
}

function walk(dir: string, skip: string): string[] {
  const out: string[] = [];
  const entries = readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name));
  for (const e of entries) {
    const p = join(dir, e.name);
    if (e.isDirectory()) {
      if (resolve(p) === skip || e.name.startsWith('.') || e.name === 'node_modules' || isBatchOutput(p)) continue;
      out.push(...walk(p, skip));
    } else if (e.isFile() && extname(e.name).toLowerCase() === '.dxf') {
      out.push(p);
    }
  }
  return out;
}

/** An earlier batch's output folder: its annotated drawings are not drawings to check. */
const isBatchOutput = (dir: string) => existsSync(join(dir, '.results')) && existsSync(join(dir, 'summary.json'));

/** `a/b/plan.dxf` → `a_b_plan-1f3e2a9c`: the relative path made safe for a file name, plus a hash of the full path. */
export function outputName(rel: string, abs: string): string {
  const readable = rel.replace(/\.dxf$/i, '').replace(/[^A-Za-z0-9._-]+/g, '_').replace(/^[._]+/, '').slice(0, 80) || 'drawing';
  return `${readable}-${createHash('sha256').update(abs).digest('hex').slice(0, 8)}`;
}
