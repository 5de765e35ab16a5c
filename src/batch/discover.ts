// Finds the drawings of a batch: DXF and DWG files in folders (recursively, extension in any case) and files named
// directly, each with the root it was found under, in a stable order; and each drawing's config file.

import { type Dirent, existsSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { dirname, extname, join, relative, resolve, sep } from 'node:path';
import { createHash } from 'node:crypto';
import { InputError } from '../input-error.js';
import { pushAll } from '../arrays.js';

export interface BatchItem {
  /** Path as found (for messages and reports). */
  file: string;
  /** Path relative to its root, with / separators. */
  rel: string;
  root: string;
  /** Output base name: readable, and unique even for same-named files in two folders. */
  name: string;
}

/** A file or link the batch saw and did not check, with the reason. */
export interface Skipped {
  file: string;
  reason: string;
}

/** The drawings of a batch, in a stable order, and what was passed over and why. */
export function discoverDrawings(inputs: string[], outDir: string): { items: BatchItem[]; skipped: Skipped[] } {
  const out = resolve(outDir);
  const items: BatchItem[] = [];
  const skipped: Skipped[] = [];
  const seen = new Set<string>();
  const add = (file: string, root: string) => {
    const abs = resolve(file);
    const real = realOrSelf(abs);
    if (seen.has(real)) return;
    seen.add(real);
    const rel = relative(root, abs).split(sep).join('/');
    items.push({ file, rel, root, name: outputName(rel, abs) });
  };
  for (const input of inputs) {
    if (!existsSync(input)) throw new InputError(`${input}: no such file or folder`);
    if (statSync(input).isDirectory()) {
      const root = resolve(input);
      const files = walk(input, { skip: out, root: realOrSelf(root), visited: new Set([realOrSelf(root)]), skipped });
      if (!files) throw new InputError(`${input}: the folder cannot be read`);
      for (const f of files) add(f, root);
    } else {
      add(input, resolve(dirname(input)));
    }
  }
  items.sort((a, b) => (a.root === b.root ? a.rel.localeCompare(b.rel) : a.root.localeCompare(b.root)));
  return { items, skipped };
}

const realOrSelf = (p: string) => {
  try {
    return realpathSync(p);
  } catch {
    return p;
  }
};

const statOrNull = (p: string) => {
  try {
    return statSync(p);
  } catch {
    return null;
  }
};

const isDrawingName = (name: string) => ['.dxf', '.dwg'].includes(extname(name).toLowerCase());

/**
 * Drawings under `dir`, or null where it cannot be listed. A symbolic link is followed where it points inside the
 * batch folder (a folder once only), else listed as skipped: a batch reads what it was given, not what a link
 * reaches elsewhere. A folder inside that cannot be listed (no permission, or removed while the batch looks) is
 * listed as skipped.
 */
function walk(dir: string, o: { skip: string; root: string; visited: Set<string>; skipped: Skipped[] }): string[] | null {
  const out: string[] = [];
  let entries: Dirent[];
  try {
    entries = readdirSync(dir, { withFileTypes: true }).sort((a, b) => a.name.localeCompare(b.name));
  } catch {
    return null;
  }
  for (const e of entries) {
    const p = join(dir, e.name);
    let isDir = e.isDirectory();
    let isFile = e.isFile();
    if (e.isSymbolicLink()) {
      const target = realOrSelf(p);
      if (target === p || !existsSync(target)) {
        o.skipped.push({ file: p, reason: 'a symbolic link to nothing' });
        continue;
      }
      if (target !== o.root && !target.startsWith(`${o.root}${sep}`)) {
        if (isDrawingName(e.name) || statOrNull(target)?.isDirectory())
          o.skipped.push({ file: p, reason: `a symbolic link out of the batch folder (to ${target}): not followed` });
        continue;
      }
      const st = statOrNull(target);
      isDir = st?.isDirectory() === true;
      isFile = st?.isFile() === true;
    }
    if (isDir) {
      if (resolve(p) === o.skip || e.name.startsWith('.') || e.name === 'node_modules' || isBatchOutput(p)) continue;
      const real = realOrSelf(p);
      if (o.visited.has(real)) continue;
      o.visited.add(real);
      const inside = walk(p, o);
      if (inside) pushAll(out, inside);
      else o.skipped.push({ file: p, reason: 'a folder that cannot be read' });
    } else if (isFile && isDrawingName(e.name)) {
      out.push(p);
    }
  }
  return out;
}

/** An earlier batch's output folder: its annotated drawings are not drawings to check. */
const isBatchOutput = (dir: string) => existsSync(join(dir, '.results')) && existsSync(join(dir, 'summary.json'));

/** `a/b/plan.dxf` → `a_b_plan-1f3e2a9c`: the relative path made safe for a file name, plus a hash of the full path. */
function outputName(rel: string, abs: string): string {
  const readable =
    rel
      .replace(/\.(dxf|dwg)$/i, '')
      .replace(/[^A-Za-z0-9._-]+/g, '_')
      .replace(/^[._]+/, '')
      .slice(0, 80) || 'drawing';
  return `${readable}-${createHash('sha256').update(abs).digest('hex').slice(0, 8)}`;
}
