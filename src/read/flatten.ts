// Expands the decoded drawing into world geometry in feet: block references recursively with their full placement
// (base point, scale including mirroring, rotation, MINSERT arrays, nesting), attributes attached; every other
// entity hands on its own geometry through its module.

import type { InputLimits } from '../config/settings.js';
import { apply, compose, determinant, meanScale, rotationOf, scaling, type Affine } from '../geometry/affine.js';
import { distance } from '../geometry/point.js';
import { fail } from '../input-error.js';
import type { AttDef } from './entities/attdef.js';
import { placements, type Insert } from './entities/insert.js';
import { kindOf } from './entities/registry.js';
import type { EntityBase, ExpandContext } from './entities/types.js';
import type { RawBlock, RawDrawing } from './select.js';
import type { Point } from '../geometry/point.js';
import type { BlockRef, Outline, PointItem, Stroke, SymbolItem, TextItem } from './types.js';

export interface Flattened {
  refs: BlockRef[];
  strokes: Stroke[];
  outlines: Outline[];
  texts: TextItem[];
  points: PointItem[];
  symbols: SymbolItem[];
}

/** Which layers each kind of item is kept for (the reader keeps what the layer roles need). */
export type FlattenKeep = Record<keyof Flattened, (layer: string) => boolean>;

interface Context {
  m: Affine;
  layer: string | null;
  handle: string | null;
  parents: string[];
}

/** The entity's own coordinate system: an extrusion of (0, 0, −1) reverses x; other tilts are taken as plan. */
const ocsOf = (e: EntityBase): Affine | null => (e.extrusionZ < 0 ? scaling(-1, 1) : null);

export function flatten(
  raw: RawDrawing,
  feetPerUnit: number,
  limits: Pick<InputLimits, 'blockDepth' | 'blockReferences'>,
  keep: FlattenKeep,
): Flattened {
  const out: Flattened = { refs: [], strokes: [], outlines: [], texts: [], points: [], symbols: [] };
  let refCount = 0;

  const walk = (entities: EntityBase[], ctx: Context) => {
    for (const e of entities) {
      if (ctx.parents.length === 0 && e.paperSpace) continue;
      const layer = e.layer === '0' && ctx.layer !== null ? ctx.layer : e.layer;
      const handle = ctx.handle ?? e.handle;
      if (e.type === 'INSERT') expandInsert(e as Insert, layer, handle, ctx);
      else kindOf(e.type)?.expand?.(e, new GeometrySink(out, keep, e, layer, handle, ctx.m, ctx.parents.length === 0));
    }
  };

  /** What every reference to a block shares: its attribute definitions' defaults, and whether it nests references. */
  const blockFacts = new Map<RawBlock, { defaults: Record<string, string>; hasNestedRefs: boolean }>();
  const factsOf = (block: RawBlock) => {
    let facts = blockFacts.get(block);
    if (facts) return facts;
    const defaults: Record<string, string> = {};
    for (const def of block.entities)
      if (def.type === 'ATTDEF' && (def as AttDef).tag) defaults[(def as AttDef).tag.toUpperCase()] = (def as AttDef).value;
    facts = { defaults, hasNestedRefs: block.entities.some((x) => x.type === 'INSERT') };
    blockFacts.set(block, facts);
    return facts;
  };

  const expandInsert = (e: Insert, layer: string, handle: string, ctx: Context) => {
    const block = raw.block(e.block);
    if (!block) return;
    const name = e.block;
    if (ctx.parents.includes(name)) fail(`block "${name}" contains a reference to itself`);
    if (ctx.parents.length + 1 > limits.blockDepth)
      fail(`block nesting deeper than ${limits.blockDepth} levels at "${name}" (inputLimits.blockDepth)`);
    const { defaults, hasNestedRefs } = factsOf(block);
    const attributes: Record<string, string> = Object.assign({}, defaults, e.attributes);
    if (refCount + e.columns * e.rows > limits.blockReferences)
      fail(`more than ${limits.blockReferences} block references after expansion (inputLimits.blockReferences)`);
    for (const placement of placements(e, block.base)) {
      const m = compose(ctx.m, placement);
      refCount++;
      if (keep.refs(layer))
        out.refs.push({
          handle,
          layer,
          block: name,
          position: apply(m, block.base),
          rotationDeg: (rotationOf(m) * 180) / Math.PI,
          mirrored: determinant(m) < 0,
          attributes,
          parents: ctx.parents,
          hasNestedRefs,
        });
      walk(block.entities, { m, layer, handle, parents: [...ctx.parents, name] });
    }
  };

  walk(raw.entities, { m: scaling(feetPerUnit, feetPerUnit), layer: null, handle: null, parents: [] });
  return out;
}

/**
 * Where one entity hands on its geometry: into `out`, for the layers that keep each kind of item. A class, so that
 * each of a drawing's entities costs one small object rather than five closures.
 */
class GeometrySink implements ExpandContext {
  readonly ocs: Affine;

  constructor(
    private readonly out: Flattened,
    private readonly keep: FlattenKeep,
    private readonly entity: EntityBase,
    private readonly layer: string,
    private readonly handle: string,
    readonly m: Affine,
    private readonly topLevel: boolean,
  ) {
    const ocs = ocsOf(entity);
    this.ocs = ocs ? compose(m, ocs) : m;
  }

  stroke(points: Point[], t: Affine, localLength: number): void {
    if (!this.keep.strokes(this.layer)) return;
    const world = points.map((p) => apply(t, p));
    let len = 0;
    for (let k = 1; k < world.length; k++) len += distance(world[k - 1]!, world[k]!);
    // The true length scales with a similarity; a stretched curve is measured along its samples.
    const similar = Math.abs(Math.abs(t.a * t.a + t.b * t.b) - Math.abs(determinant(t))) < 1e-9 * Math.abs(determinant(t));
    this.out.strokes.push({
      handle: this.handle,
      layer: this.layer,
      type: this.entity.type,
      a: world[0]!,
      b: world[world.length - 1]!,
      via: world.slice(1, -1),
      length: similar ? localLength * meanScale(t) : len,
    });
  }

  outline(points: () => Point[], t: Affine): void {
    if (this.keep.outlines(this.layer))
      this.out.outlines.push({ handle: this.handle, layer: this.layer, type: this.entity.type, points: points().map((p) => apply(t, p)) });
  }

  text(at: Point, t: Affine, text: string, localHeight: number): void {
    if (this.keep.texts(this.layer))
      this.out.texts.push({ handle: this.handle, layer: this.layer, position: apply(t, at), text, height: localHeight * meanScale(t) });
  }

  point(at: Point, t: Affine): void {
    if (this.keep.points(this.layer)) this.out.points.push({ handle: this.handle, layer: this.layer, position: apply(t, at) });
    if (this.topLevel && this.keep.symbols(this.layer))
      this.out.symbols.push({ handle: this.handle, layer: this.layer, position: apply(t, at), type: 'POINT', radius: 0 });
  }

  symbol(center: Point, t: Affine, localRadius: number): void {
    if (this.topLevel && this.keep.symbols(this.layer))
      this.out.symbols.push({
        handle: this.handle,
        layer: this.layer,
        position: apply(t, center),
        type: 'CIRCLE',
        radius: localRadius * meanScale(t),
      });
  }
}
