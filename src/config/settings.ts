// The config file (CONTRACT keys, every one optional) validated into Settings in internal units:
// feet, ft², gpm, psi, gpm/ft², US K-factors. Every problem is a one-line InputError naming the key.

import { fail } from '../read/errors.js';
import type { LengthUnit } from '../read/types.js';
import { isLengthUnit } from '../read/units.js';
import { BAR_PER_PSI, KSI_PER_KUS, L_PER_GAL, M2_PER_FT2, MMMIN_PER_GPMFT2, M_PER_FT, type UnitSystem } from '../quantities/convert.js';

export type LayerRole = 'heads' | 'pipes' | 'walls' | 'designArea' | 'source';
export const LAYER_ROLES: readonly LayerRole[] = ['heads', 'pipes', 'walls', 'designArea', 'source'];

export type Hazard = 'LH' | 'OH1' | 'OH2' | 'EH1' | 'EH2';
export const HAZARDS: readonly Hazard[] = ['LH', 'OH1', 'OH2', 'EH1', 'EH2'];
export type SystemType = 'wet' | 'dry' | 'preaction';
export type AreaMode = 'drawn' | 'search' | 'both';
export type Schedule = '10' | '40';

/**
 * How much of a drawing is accepted (common practice, no source: each far above a real plan file), so that a
 * hostile or broken file ends in a clear error rather than exhausting memory or time. Each can be raised.
 */
export interface InputLimits {
  /** File size, MiB. */
  fileMB: number;
  /** Entities in the file, blocks included. */
  entities: number;
  /** Block nesting depth. */
  blockDepth: number;
  /** Block references once expanded (nesting and arrays multiply), on the layers that are read. */
  blockReferences: number;
  /** Characters in one value (a text, a name). */
  textLength: number;
  /** Nodes of the rebuilt piping network. */
  networkNodes: number;
}

export const DEFAULT_INPUT_LIMITS: InputLimits = {
  fileMB: 512, entities: 5_000_000, blockDepth: 32, blockReferences: 2_000_000, textLength: 65_536, networkNodes: 1_000_000,
};

export interface Settings {
  /** The drawing's length unit, when the config states it. */
  units?: LengthUnit;
  unitSystem: UnitSystem;
  /** Layer patterns per role; a role without patterns is guessed. */
  layers: Partial<Record<LayerRole, string[]>>;
  headBlocks: string[];
  defaults: {
    kFactor: number;
    pipeSize: string;
    cFactor: number;
    schedule: Schedule;
    headElevation: number;
    sourceElevation: number;
  };
  design: {
    hazard: Hazard;
    density?: number;
    area?: number;
    hoseAllowance?: number;
    minHeadPressure: number;
    fittings: boolean;
    velocityPressure: boolean;
    systemType: SystemType;
    areaMode: AreaMode;
    quickResponse: boolean;
    ceilingHeight?: number;
    ceilingSlope?: number;
  };
  supply?: { static: number; residual: number; flow: number };
  /** Overrides of the rules' limit table, by limit key, in the config's unit system. */
  limits: Record<string, number>;
  /** Geometry tolerances, feet. */
  tolerances: { snap: number; headAttach: number; sizeLabel: number };
  inputLimits: InputLimits;
}

/** The drawing-independent defaults (CONTRACT example values; common practice). */
export const DEFAULT_SETTINGS: Settings = {
  unitSystem: 'us',
  layers: {},
  headBlocks: ['*'],
  defaults: { kFactor: 5.6, pipeSize: '1', cFactor: 120, schedule: '40', headElevation: 12, sourceElevation: 0 },
  design: {
    hazard: 'OH2', minHeadPressure: 7, fittings: true, velocityPressure: false, systemType: 'wet', areaMode: 'both',
    quickResponse: false,
  },
  limits: {},
  // Snap 1 in, a head up to 6 in off its pipe, a size label up to 3 ft from its pipe (common practice, no source).
  tolerances: { snap: 1 / 12, headAttach: 0.5, sizeLabel: 3 },
  inputLimits: DEFAULT_INPUT_LIMITS,
};

type Json = Record<string, unknown>;

class Reader {
  constructor(private readonly where: string) {}
  private bad(key: string, what: string): never {
    return fail(`${this.where}: "${key}" ${what}`);
  }
  object(obj: Json, key: string): Json | undefined {
    const v = obj[key.split('.').pop()!];
    if (v === undefined) return undefined;
    if (v === null || typeof v !== 'object' || Array.isArray(v)) this.bad(key, 'must be an object');
    return v as Json;
  }
  number(obj: Json, key: string, opts: { min?: number; positive?: boolean } = {}): number | undefined {
    const v = obj[key.split('.').pop()!];
    if (v === undefined) return undefined;
    if (typeof v !== 'number' || !Number.isFinite(v)) this.bad(key, 'must be a number');
    const n = v as number;
    if (opts.positive && !(n > 0)) this.bad(key, 'must be greater than 0');
    if (opts.min !== undefined && n < opts.min) this.bad(key, `must be at least ${opts.min}`);
    return n;
  }
  boolean(obj: Json, key: string): boolean | undefined {
    const v = obj[key.split('.').pop()!];
    if (v === undefined) return undefined;
    if (typeof v !== 'boolean') this.bad(key, 'must be true or false');
    return v as boolean;
  }
  choice<T extends string>(obj: Json, key: string, allowed: readonly T[]): T | undefined {
    const v = obj[key.split('.').pop()!];
    if (v === undefined) return undefined;
    const s = typeof v === 'number' ? String(v) : v;
    if (typeof s !== 'string' || !allowed.includes(s as T)) this.bad(key, `must be one of ${allowed.join(', ')}`);
    return s as T;
  }
  strings(obj: Json, key: string): string[] | undefined {
    const v = obj[key.split('.').pop()!];
    if (v === undefined) return undefined;
    const list = typeof v === 'string' ? [v] : v;
    if (!Array.isArray(list) || list.some((x) => typeof x !== 'string')) this.bad(key, 'must be a list of names');
    return list as string[];
  }
  string(obj: Json, key: string): string | undefined {
    const v = obj[key.split('.').pop()!];
    if (v === undefined) return undefined;
    if (typeof v !== 'string' && typeof v !== 'number') this.bad(key, 'must be a text');
    return String(v);
  }
}

const KNOWN_TOP = ['units', 'unitSystem', 'layers', 'headBlocks', 'defaults', 'design', 'supply', 'limits', 'tolerances', 'inputLimits', '$schema', 'comment'];

/** Validates a parsed config object; `where` names it in messages (the file name). */
export function parseSettings(raw: unknown, where = 'config'): Settings {
  if (raw === undefined || raw === null) return structuredClone(DEFAULT_SETTINGS);
  if (typeof raw !== 'object' || Array.isArray(raw)) fail(`${where}: the config must be a JSON object`);
  const root = raw as Json;
  for (const key of Object.keys(root)) if (!KNOWN_TOP.includes(key)) fail(`${where}: unknown key "${key}"`);
  const r = new Reader(where);
  const s: Settings = structuredClone(DEFAULT_SETTINGS);

  const units = r.string(root, 'units');
  if (units !== undefined) {
    if (!isLengthUnit(units)) fail(`${where}: "units" must be one of in, ft, mm, cm, m`);
    s.units = units as LengthUnit;
  }
  s.unitSystem = r.choice(root, 'unitSystem', ['us', 'si'] as const) ?? 'us';
  const si = s.unitSystem === 'si';
  const len = (v: number | undefined) => (v === undefined ? undefined : si ? v / M_PER_FT : v);
  const psi = (v: number | undefined) => (v === undefined ? undefined : si ? v / BAR_PER_PSI : v);
  const gpm = (v: number | undefined) => (v === undefined ? undefined : si ? v / L_PER_GAL : v);

  const layers = r.object(root, 'layers');
  if (layers) {
    for (const key of Object.keys(layers)) {
      if (!LAYER_ROLES.includes(key as LayerRole)) fail(`${where}: unknown layer role "layers.${key}"`);
      s.layers[key as LayerRole] = r.strings(layers, `layers.${key}`);
    }
  }
  s.headBlocks = r.strings(root, 'headBlocks') ?? s.headBlocks;

  const d = r.object(root, 'defaults');
  if (d) {
    const k = r.number(d, 'defaults.kFactor', { positive: true });
    if (k !== undefined) s.defaults.kFactor = si ? k / KSI_PER_KUS : k;
    s.defaults.pipeSize = r.string(d, 'defaults.pipeSize') ?? s.defaults.pipeSize;
    s.defaults.cFactor = r.number(d, 'defaults.cFactor', { positive: true }) ?? s.defaults.cFactor;
    s.defaults.schedule = r.choice(d, 'defaults.schedule', ['10', '40'] as const) ?? s.defaults.schedule;
    s.defaults.headElevation = len(r.number(d, 'defaults.headElevation')) ?? s.defaults.headElevation;
    s.defaults.sourceElevation = len(r.number(d, 'defaults.sourceElevation')) ?? s.defaults.sourceElevation;
  }

  const g = r.object(root, 'design');
  if (g) {
    const dz = s.design;
    dz.hazard = r.choice(g, 'design.hazard', HAZARDS) ?? dz.hazard;
    const density = r.number(g, 'design.density', { positive: true });
    if (density !== undefined) dz.density = si ? density / MMMIN_PER_GPMFT2 : density;
    const area = r.number(g, 'design.area', { positive: true });
    if (area !== undefined) dz.area = si ? area / M2_PER_FT2 : area;
    dz.hoseAllowance = gpm(r.number(g, 'design.hoseAllowance', { min: 0 })) ?? dz.hoseAllowance;
    dz.minHeadPressure = psi(r.number(g, 'design.minHeadPressure', { positive: true })) ?? dz.minHeadPressure;
    dz.fittings = r.boolean(g, 'design.fittings') ?? dz.fittings;
    dz.velocityPressure = r.boolean(g, 'design.velocityPressure') ?? dz.velocityPressure;
    dz.systemType = r.choice(g, 'design.systemType', ['wet', 'dry', 'preaction'] as const) ?? dz.systemType;
    dz.areaMode = r.choice(g, 'design.areaMode', ['drawn', 'search', 'both'] as const) ?? dz.areaMode;
    dz.quickResponse = r.boolean(g, 'design.quickResponse') ?? dz.quickResponse;
    dz.ceilingHeight = len(r.number(g, 'design.ceilingHeight', { positive: true }));
    dz.ceilingSlope = r.number(g, 'design.ceilingSlope', { min: 0 });
  }

  const sup = r.object(root, 'supply');
  if (sup) {
    const st = psi(r.number(sup, 'supply.static', { positive: true }));
    const res = psi(r.number(sup, 'supply.residual', { min: 0 }));
    const fl = gpm(r.number(sup, 'supply.flow', { positive: true }));
    if (st === undefined || res === undefined || fl === undefined) fail(`${where}: "supply" needs static, residual and flow`);
    if (res! >= st!) fail(`${where}: "supply.residual" must be lower than "supply.static"`);
    s.supply = { static: st!, residual: res!, flow: fl! };
  }

  const lim = r.object(root, 'limits');
  if (lim) for (const key of Object.keys(lim)) s.limits[key] = r.number(lim, `limits.${key}`)!;

  const tol = r.object(root, 'tolerances');
  if (tol) {
    s.tolerances.snap = len(r.number(tol, 'tolerances.snap', { positive: true })) ?? s.tolerances.snap;
    s.tolerances.headAttach = len(r.number(tol, 'tolerances.headAttach', { positive: true })) ?? s.tolerances.headAttach;
    s.tolerances.sizeLabel = len(r.number(tol, 'tolerances.sizeLabel', { positive: true })) ?? s.tolerances.sizeLabel;
  }

  const il = r.object(root, 'inputLimits');
  if (il) {
    for (const key of Object.keys(il)) {
      if (!(key in DEFAULT_INPUT_LIMITS)) fail(`${where}: unknown key "inputLimits.${key}"`);
      s.inputLimits[key as keyof InputLimits] = r.number(il, `inputLimits.${key}`, { positive: true })!;
    }
  }
  return s;
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
