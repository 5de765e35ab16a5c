// Reads a config (parsed JSON or its text) into Settings by the one schema: every problem is a one-line
// InputError naming the key by its dotted path, with the nearest known key for a misspelt one.

import * as v from 'valibot';
import { fail } from '../input-error.js';
import type { UnitSystem } from '../quantities/convert.js';
import { configSchema, type ConfigSchema, type Settings } from './schema.js';

export { HAZARDS, LAYER_ROLES, LENGTH_UNITS, type Hazard, type LayerRole, type LengthUnit } from './names.js';
export {
  QUANTITIES,
  type DesignSettings,
  type InputLimits,
  type QuantityKind,
  type Settings,
  type SystemType,
  type ZoneSettings,
} from './schema.js';

const SCHEMAS: Record<UnitSystem, ConfigSchema> = { us: configSchema('us'), si: configSchema('si') };

/** The defaults alone: a config of `{}`. */
export const DEFAULT_SETTINGS: Readonly<Settings> = v.parse(SCHEMAS.us, {});
export const DEFAULT_INPUT_LIMITS = DEFAULT_SETTINGS.inputLimits;

/** Validates a parsed config object; `where` names it in messages (the file name). */
export function parseSettings(raw: unknown, where = 'config'): Settings {
  if (raw === undefined || raw === null) return structuredClone(DEFAULT_SETTINGS);
  const system = (raw as { unitSystem?: unknown }).unitSystem === 'si' ? 'si' : 'us';
  const schema = SCHEMAS[system];
  const list = listWhereObject(schema, raw, []);
  if (list) fail(`${where}: ${list.length ? `"${list.join('.')}" must be an object` : 'the config must be a JSON object'}`);
  const result = v.safeParse(schema, raw);
  if (result.success) return result.output;
  // A misspelt key is said first: a key it leaves missing is its consequence.
  const unknown = result.issues.find((i) => i.type === 'strict_object' && i.expected === 'never');
  return fail(`${where}: ${describeIssue(schema, unknown ?? result.issues[0], raw)}`);
}

/** Parses config text (JSON); `where` names the file in messages. */
export function parseSettingsText(text: string, where: string): Settings {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (err) {
    fail(`${where}: not valid JSON (${err instanceof Error ? err.message : String(err)})`);
  }
  return parseSettings(raw, where);
}

/** One issue as one line: the key's dotted path and what is wrong with its value. */
function describeIssue(schema: ConfigSchema, issue: v.BaseIssue<unknown>, raw: unknown): string {
  const keys = (issue.path ?? []).map((p) => String(p.key));
  const path = keys.join('.');
  if (issue.type === 'strict_object' && issue.expected === 'never') {
    const near = nearest(keys.at(-1)!, knownKeys(schema, keys.slice(0, -1), raw));
    const parent = keys.slice(0, -1).join('.');
    return `unknown key "${path}"${near ? ` (did you mean "${parent ? `${parent}.` : ''}${near}"?)` : ''}`;
  }
  if (!path) return 'the config must be a JSON object';
  if (issue.type === 'strict_object' && issue.input === undefined) return `"${path}" is missing`;
  const shown = issue.kind === 'schema' ? `, not ${preview(issue.input)}` : '';
  return `"${path}" ${issue.message}${shown}`;
}

const preview = (x: unknown) => {
  const s = JSON.stringify(x) ?? String(x);
  return s.length > 40 ? `${s.slice(0, 37)}...` : s;
};

/** A schema node as the walks below see it: an object's entries, a record's values, a list's item, the wrapped schema. */
interface SchemaNode {
  type?: string;
  wrapped?: unknown;
  options?: unknown[];
  entries?: Record<string, unknown>;
  value?: unknown;
  item?: unknown;
  literal?: unknown;
}

/** The node itself, through optional and union wrappers (a union's object option). */
function unwrap(s: unknown): SchemaNode {
  const x = s as SchemaNode;
  if (x.type === 'optional') return unwrap(x.wrapped);
  if (x.type === 'union') return x.options?.map(unwrap).find((o) => o.entries) ?? x;
  return x;
}

/** The schema node of the value at `path` in `raw`: into lists by index, and a variant by the value's own tag. */
function nodeAt(schema: v.GenericSchema, path: string[], raw?: unknown): SchemaNode {
  let at = unwrap(schema);
  let value = raw as Record<string, unknown> | undefined;
  for (const key of path) {
    at = unwrap(at.type === 'record' ? at.value : at.type === 'array' ? at.item : at.entries?.[key]);
    value = value && typeof value === 'object' ? (value[key] as Record<string, unknown> | undefined) : undefined;
    if (at.type === 'variant') {
      const options = (at.options ?? []).map(unwrap);
      at = options.find((o) => unwrap(o.entries?.['type']).literal === value?.['type']) ?? options[0] ?? at;
    }
  }
  return at;
}

/** The keys an object of the schema takes at `path` (in `raw`, whose values choose a variant's keys). */
function knownKeys(schema: v.GenericSchema, path: string[], raw?: unknown): string[] {
  return Object.keys(nodeAt(schema, path, raw).entries ?? {});
}

/** The path of the first list given where the schema wants an object (JSON arrays are objects to a validator), or null. */
function listWhereObject(schema: v.GenericSchema, raw: unknown, path: string[]): string[] | null {
  const node = nodeAt(schema, path);
  if (!node.entries && node.type !== 'record') return null;
  if (Array.isArray(raw)) return path;
  if (!raw || typeof raw !== 'object') return null;
  for (const [key, value] of Object.entries(raw)) {
    if (node.type !== 'record' && !(key in node.entries!)) continue;
    const found = listWhereObject(schema, value, [...path, key]);
    if (found) return found;
  }
  return null;
}

/** The known key nearest a misspelt one: edit distance at most 2, or a third of its length (case ignored). */
export function nearest(word: string, known: readonly string[]): string | null {
  let best: string | null = null;
  let bestD = Infinity;
  for (const k of known) {
    const d = editDistance(word.toLowerCase(), k.toLowerCase());
    if (d < bestD) {
      bestD = d;
      best = k;
    }
  }
  return best !== null && bestD <= Math.max(2, Math.floor(word.length / 3)) ? best : null;
}

function editDistance(a: string, b: string): number {
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = [i];
    for (let j = 1; j <= b.length; j++) row[j] = Math.min(prev[j]! + 1, row[j - 1]! + 1, prev[j - 1]! + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = row;
  }
  return prev[b.length]!;
}
