// dxf-parser entity handlers that replace its stock ones where those drop data (ATTRIB) or can spin forever
// on a damaged file (POLYLINE, LWPOLYLINE), and skip the entity types no stage uses.

import type { IEntity } from 'dxf-parser';

interface Group {
  code: number;
  value: number | string | boolean;
}
/** The part of dxf-parser's scanner a handler uses. */
interface Scanner {
  next(): Group;
  isEOF(): boolean;
}
type Fields = IEntity & Record<string, unknown>;

export interface AttribEntity extends IEntity {
  tag: string;
  value: string;
}

const num = (v: unknown): number => (typeof v === 'number' ? v : Number.NaN);

/**
 * Reads the groups after `0/TYPE` up to the next code 0, giving each to `take`; every call advances the
 * scanner, so no damaged file can make a handler loop. Returns the code-0 group that ended the run.
 */
function readFields(scanner: Scanner, take: (g: Group) => void): Group {
  let curr = scanner.next();
  while (!scanner.isEOF() && curr.code !== 0) {
    take(curr);
    curr = scanner.next();
  }
  return curr;
}

/** Groups every entity shares: handle, layer, paper space, owner. */
function takeCommon(entity: Fields, g: Group): boolean {
  if (g.code === 5) entity.handle = g.value as unknown as number;
  else if (g.code === 8) entity.layer = String(g.value);
  else if (g.code === 67) entity.inPaperSpace = g.value === 1 || g.value === true;
  else if (g.code === 330) entity.ownerHandle = String(g.value);
  else return false;
  return true;
}

/**
 * A handler for an entity read in one run of groups: `start` makes it, `take` reads each group that is not one
 * every entity shares.
 */
const handlerFor = (type: string, start: () => Fields, take: (entity: Fields, g: Group) => void) =>
  class {
    readonly ForEntityName = type;
    parseEntity(scanner: Scanner): IEntity {
      const entity = start();
      readFields(scanner, (g) => { if (!takeCommon(entity, g)) take(entity, g); });
      return entity;
    }
  };

/** ATTRIB: the stock parser skips these, losing head K-factors and elevations. */
const AttribHandler = handlerFor('ATTRIB', () => ({ type: 'ATTRIB', tag: '', value: '' }) as unknown as Fields, (entity, g) => {
  if (g.code === 1) entity['value'] = String(g.value);
  else if (g.code === 2) entity['tag'] = String(g.value);
});

/**
 * LWPOLYLINE: each code 10 starts a vertex. The stock handler (1.1.2) rewinds to the vertex it was reading when
 * an unknown code sits among the vertices, and then reads it again forever.
 */
const LwpolylineHandler = handlerFor('LWPOLYLINE', () => ({ type: 'LWPOLYLINE', vertices: [] }) as unknown as Fields, (entity, g) => {
  const vertices = entity['vertices'] as Record<string, number>[];
  const vertex = vertices.at(-1);
  if (g.code === 10) vertices.push({ x: num(g.value) });
  else if (g.code === 20 && vertex) vertex['y'] = num(g.value);
  else if (g.code === 42 && vertex) vertex['bulge'] = num(g.value);
  else if (g.code === 70) entity['shape'] = (num(g.value) & 1) === 1;
  else if (g.code === 230) entity['extrusionDirectionZ'] = num(g.value);
});

/**
 * Old-style POLYLINE with its VERTEX run and SEQEND. The stock handler (1.1.2) loops without advancing when
 * anything but VERTEX or SEQEND follows a vertex.
 */
class PolylineHandler {
  readonly ForEntityName = 'POLYLINE';
  parseEntity(scanner: Scanner): IEntity {
    const vertices: Record<string, number>[] = [];
    const entity = { type: 'POLYLINE', vertices } as unknown as Fields;
    let curr = readFields(scanner, (g) => {
      if (takeCommon(entity, g)) return;
      if (g.code === 70) {
        const f = num(g.value);
        entity['shape'] = (f & 1) !== 0; entity['is3dPolyline'] = (f & 8) !== 0;
        entity['is3dPolygonMesh'] = (f & 16) !== 0; entity['isPolyfaceMesh'] = (f & 64) !== 0;
      } else if (g.code === 230) entity['extrusionDirection'] = { x: 0, y: 0, z: num(g.value) };
    });
    while (!scanner.isEOF() && curr.value === 'VERTEX') {
      const vertex: Record<string, number> = {};
      curr = readFields(scanner, (g) => {
        if (g.code === 10) vertex['x'] = num(g.value);
        else if (g.code === 20) vertex['y'] = num(g.value);
        else if (g.code === 42) vertex['bulge'] = num(g.value);
        else if (g.code === 70) vertex['flags'] = num(g.value);
      });
      vertices.push(vertex);
    }
    if (!scanner.isEOF() && curr.value === 'SEQEND') readFields(scanner, () => undefined);
    return entity;
  }
}

/** Entity types no stage reads (dimensions, splines, ellipses, solids, faces): skipped unparsed. */
const SKIPPED_TYPES = ['DIMENSION', 'SPLINE', 'ELLIPSE', 'SOLID', '3DFACE'] as const;

const skipperFor = (type: string) => handlerFor(type, () => ({ type }) as Fields, () => undefined);

/** Every handler the reader registers on top of dxf-parser's defaults. */
export const ENTITY_HANDLERS = [AttribHandler, LwpolylineHandler, PolylineHandler, ...SKIPPED_TYPES.map(skipperFor)];
