// Which config a drawing is checked with, found the same way by `check` and `batch`: NAME.config.json beside the
// drawing, else headcheck.json in its folder or the nearest parent (up to the batch root), else the fallback.

import { existsSync, readFileSync } from 'node:fs';
import { basename, dirname, extname, join, resolve, sep } from 'node:path';
import { DEFAULT_SETTINGS, parseSettingsText, type Settings } from '../config/settings.js';
import { InputError } from '../input-error.js';

export interface FoundConfig {
  path: string;
  /** How it was found, for the line that says so. */
  how: 'given' | 'beside the drawing' | 'in a parent folder';
}

/**
 * The config of `drawing`: `NAME.config.json` beside it, else `headcheck.json` in its folder or the nearest parent
 * (not above `root` when given), else `fallback` (a `--config` path), else none.
 */
export function findConfig(drawing: string, options: { root?: string; fallback?: string } = {}): FoundConfig | null {
  const abs = resolve(drawing);
  const beside = join(dirname(abs), `${basename(abs, extname(abs))}.config.json`);
  if (existsSync(beside)) return { path: beside, how: 'beside the drawing' };
  const root = options.root ? resolve(options.root) : null;
  for (let d = dirname(abs); ; d = dirname(d)) {
    const candidate = join(d, 'headcheck.json');
    if (existsSync(candidate)) return { path: candidate, how: 'in a parent folder' };
    if (d === root || d === dirname(d) || (root !== null && !`${d}${sep}`.startsWith(`${root}${sep}`))) break;
  }
  return options.fallback ? { path: options.fallback, how: 'given' } : null;
}

/** Reads and validates a config file; none: the defaults. Errors name the file. */
export function loadSettings(path: string | null | undefined): Settings {
  if (!path) return structuredClone(DEFAULT_SETTINGS);
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (err) {
    throw new InputError(`${path}: config cannot be read (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
  }
  return parseSettingsText(text, path);
}
