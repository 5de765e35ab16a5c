// Expands model space into world geometry in feet: block references recursively with their full placement
// (base point, scale including mirroring, rotation, MINSERT arrays, nesting), attributes attached.

import type { IBlock, IDxf, IEntity } from 'dxf-parser';
import type { InputLimits } from '../config/settings.js';
import { apply, compose, determinant, insertPlacement, meanScale, rotationOf, scaling, type Affine } from '../geometry/affine.js';
import { distance, type Point } from '../geometry/point.js';
import { ccwSweep, sampleArc, sampleBulge } from './arcs.js';
import { fail } from '../input-error.js';
import type { AttribEntity } from './entity-handlers.js';
import { decodeUnicodeEscapes, plainMText, plainText } from './text-codes.js';
import type { BlockRef, Outline, PointItem, Stroke, TextItem } from './types.js';

export interface Flattened {
  refs: BlockRef[];
  strokes: Stroke[];
  outlines: Outline[];
  texts: TextItem[];
  points: PointItem[];
}

interface Context {
  m: Affine;
  layer: string | null;
  handle: string | null;
  parents: string[];
}

type Raw = IEntity & Record<string, any>;

const CIRCLE_STEPS = 32;

/** Which layers each kind of item is kept for (the reader keeps what the layer roles need). */
export type FlattenKeep = Record<keyof Flattened, (layer: string) => boolean>;

export function flattenDxf(dxf: IDxf, feetPerUnit: number, limits: Pick<InputLimits, 'blockDepth' | 'blockReferences'>, keep: FlattenKeep): Flattened {
  const out: Flattened = { refs: [], strokes: [], outlines: [], texts: [], points: [] };
  const blocks: Record<string, IBlock> = dxf.blocks ?? {};
  const blockByUpper = new Map(Object.entries(blocks).map(([k, v]) => [k.toUpperCase(), v] as const));
  let refCount = 0;

  const walk = (entities: Raw[], ctx: Context) => {
    for (let i = 0; i < entities.length; i++) {
      const e = entities[i]!;
      if (ctx.parents.length === 0 && e.inPaperSpace) continue;
      if (e.type === 'ATTRIB' || e.type === 'ATTDEF') continue;
      const own = decodeUnicodeEscapes(String(e.layer ?? '0'));
      const layer = own === '0' && ctx.layer !== null ? ctx.layer : own;
      const handle = ctx.handle ?? String(e.handle ?? '');
      if (e.type === 'INSERT') {
        const attribs: AttribEntity[] = [];
        while (entities[i + 1]?.type === 'ATTRIB') attribs.push(entities[++i] as AttribEntity);
        expandInsert(e, attribs, layer, handle, ctx);
      } else {
        emitGeometry(e, layer, handle, ctx.m);
      }
    }
  };

  const expandInsert = (e: Raw, attribs: AttribEntity[], layer: string, handle: string, ctx: Context) => {
    const name = decodeUnicodeEscapes(String(e.name ?? ''));
    const block = blocks[name] ?? blockByUpper.get(name.toUpperCase());
    if (!block) return;
    if (ctx.parents.includes(name)) fail(`block "${name}" contains a reference to itself`);
    if (ctx.parents.length + 1 > limits.blockDepth) fail(`block nesting deeper than ${limits.blockDepth} levels at "${name}" (inputLimits.blockDepth)`);
    const attributes: Record<string, string> = {};
    for (const def of (block.entities ?? []) as Raw[]) {
      if (def.type === 'ATTDEF' && def.tag) attributes[String(def.tag).toUpperCase()] = plainText(String(def.text ?? ''));
    }
    for (const a of attribs) if (a.tag) attributes[a.tag.toUpperCase()] = plainText(a.value);
    const cols = Math.max(1, Math.floor(num(e.columnCount, 1)));
    const rows = Math.max(1, Math.floor(num(e.rowCount, 1)));
    if (refCount + cols * rows > limits.blockReferences) fail(`more than ${limits.blockReferences} block references after expansion (inputLimits.blockReferences)`);
    const base = pt(block.position);
    const mirror = num(e.extrusionDirection?.z, 1) < 0;
    const inner = (block.entities ?? []) as Raw[];
    const hasNestedRefs = inner.some((x) => x.type === 'INSERT');
    const rot = (num(e.rotation, 0) * Math.PI) / 180;
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const dx = c * num(e.columnSpacing, 0);
        const dy = r * num(e.rowSpacing, 0);
        const ins = pt(e.position);
        const insertion = { x: ins.x + dx * Math.cos(rot) - dy * Math.sin(rot), y: ins.y + dx * Math.sin(rot) + dy * Math.cos(rot) };
        const placement = insertPlacement({
          insertion, base, scaleX: num(e.xScale, 1), scaleY: num(e.yScale, 1), rotationDeg: num(e.rotation, 0), ocsMirror: mirror,
        });
        const m = compose(ctx.m, placement);
        refCount++;
        if (keep.refs(layer)) out.refs.push({
          handle, layer, block: name, position: apply(m, base), rotationDeg: (rotationOf(m) * 180) / Math.PI,
          mirrored: determinant(m) < 0, attributes, parents: ctx.parents, hasNestedRefs,
        });
        walk(inner, { m, layer, handle, parents: [...ctx.parents, name] });
      }
    }
  };

  const addStroke = (handle: string, layer: string, type: string, pts: Point[], m: Affine, analyticLength?: number) => {
    const world = pts.map((p) => apply(m, p));
    let len = 0;
    for (let k = 1; k < world.length; k++) len += distance(world[k - 1]!, world[k]!);
    const similar = Math.abs(Math.abs(m.a * m.a + m.b * m.b) - Math.abs(determinant(m))) < 1e-9 * Math.abs(determinant(m));
    out.strokes.push({
      handle, layer, type, a: world[0]!, b: world[world.length - 1]!, via: world.slice(1, -1),
      length: analyticLength !== undefined && similar ? analyticLength * meanScale(m) : len,
    });
  };

  const emitGeometry = (e: Raw, layer: string, handle: string, parent: Affine) => {
    const ocs = ocsOf(e);
    const m = ocs ? compose(parent, ocs) : parent;
    switch (e.type) {
      case 'LINE': {
        const v = e.vertices as Point[] | undefined;
        if (v && v.length >= 2 && keep.strokes(layer)) addStroke(handle, layer, 'LINE', [pt(v[0]), pt(v[1])], parent);
        break;
      }
      case 'LWPOLYLINE':
      case 'POLYLINE': {
        if (e.is3dPolygonMesh || e.isPolyfaceMesh) break;
        const verts = ((e.vertices ?? []) as Raw[]).filter((v) => Number.isFinite(v.x) && Number.isFinite(v.y));
        const closed = !!e.shape;
        const strokes = keep.strokes(layer);
        const outlines = closed && verts.length >= 3 && keep.outlines(layer);
        if (!strokes && !outlines) break;
        const outline: Point[] = [];
        const n = verts.length;
        for (let k = 0; k < (closed ? n : n - 1); k++) {
          const p1 = pt(verts[k]);
          const p2 = pt(verts[(k + 1) % n]);
          const bulge = num(verts[k]!.bulge, 0);
          const pts = sampleBulge(p1, p2, bulge);
          const analytic = bulge ? arcLengthOfBulge(p1, p2, bulge) : distance(p1, p2);
          if (strokes) addStroke(handle, layer, e.type, pts, e.type === 'POLYLINE' && e.is3dPolyline ? parent : m, analytic);
          outline.push(...pts.slice(0, -1));
        }
        if (outlines) out.outlines.push({ handle, layer, type: e.type, points: outline.map((p) => apply(m, p)) });
        break;
      }
      case 'ARC': {
        const c = pt(e.center);
        const r = num(e.radius, 0);
        const sweep = ccwSweep(num(e.startAngle, 0), num(e.endAngle, 0));
        if (r > 0 && keep.strokes(layer)) addStroke(handle, layer, 'ARC', sampleArc(c, r, num(e.startAngle, 0), sweep), m, r * sweep);
        break;
      }
      case 'CIRCLE': {
        const r = num(e.radius, 0);
        if (r > 0 && keep.outlines(layer)) {
          const pts = sampleArc(pt(e.center), r, 0, 2 * Math.PI).slice(0, CIRCLE_STEPS);
          out.outlines.push({ handle, layer, type: 'CIRCLE', points: pts.map((p) => apply(m, p)) });
        }
        break;
      }
      case 'TEXT': {
        if (!keep.texts(layer)) break;
        const useEnd = (num(e.halign, 0) !== 0 || num(e.valign, 0) !== 0) && e.endPoint;
        out.texts.push({
          handle, layer, position: apply(m, pt(useEnd ? e.endPoint : e.startPoint)),
          text: plainText(String(e.text ?? '')), height: num(e.textHeight, 0) * meanScale(m),
        });
        break;
      }
      case 'MTEXT':
        if (!keep.texts(layer)) break;
        out.texts.push({
          handle, layer, position: apply(parent, pt(e.position)),
          text: plainMText(String(e.text ?? '')), height: num(e.height, 0) * meanScale(parent),
        });
        break;
      case 'POINT':
        if (keep.points(layer)) out.points.push({ handle, layer, position: apply(parent, pt(e.position)) });
        break;
      default:
        break;
    }
  };

  walk((dxf.entities ?? []) as Raw[], { m: scaling(feetPerUnit, feetPerUnit), layer: null, handle: null, parents: [] });
  return out;
}

/** OCS of an entity whose extrusion is (0, 0, -1): x reversed. Other tilted extrusions are taken as plan. */
function ocsOf(e: Raw): Affine | null {
  const z = e.extrusionDirectionZ ?? e.extrusionDirection?.z;
  return typeof z === 'number' && z < 0 ? scaling(-1, 1) : null;
}

function arcLengthOfBulge(p1: Point, p2: Point, bulge: number): number {
  const c = distance(p1, p2);
  const sweep = 4 * Math.atan(Math.abs(bulge));
  const r = (c * (1 + bulge * bulge)) / (4 * Math.abs(bulge));
  return r * sweep;
}

const num = (v: unknown, fallback: number): number => (typeof v === 'number' && Number.isFinite(v) ? v : fallback);
const pt = (p: any): Point => ({ x: num(p?.x, 0), y: num(p?.y, 0) });
