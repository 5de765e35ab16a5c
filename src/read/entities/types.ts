// What an entity type brings to the reader, in one module a type (the registry lists them): how the scan and the
// layer summary count it, how its DXF groups decode into plain data, and how it becomes world geometry.

import type { Affine } from '../../geometry/affine.js';
import type { Point } from '../../geometry/point.js';
import type { EntityReader } from '../dxf/entity-reader.js';

/** What every decoded entity carries: its type, DXF handle, layer, and whether it sits in paper space. */
export interface EntityBase {
  type: string;
  handle: string;
  layer: string;
  paperSpace: boolean;
  /** Z of the extrusion direction: −1 mirrors the entity's own x axis (its OCS); other tilts are taken as plan. */
  extrusionZ: number;
}

/** How the layer summary counts an entity: linework, a closed outline (maybe), a point, a block reference. */
export type EntityShape = 'stroke' | 'outline' | 'point' | 'reference' | 'text' | 'other';

/**
 * Where an entity is expanded, and what it hands on, in its own coordinates: the context maps them to world feet
 * and keeps what the layer's roles need. `m` maps block coordinates (drawing units) to world feet; `ocs` is `m`
 * after the entity's own coordinate system (its extrusion), for the types whose points are given in it.
 */
export interface ExpandContext {
  m: Affine;
  ocs: Affine;
  /** A piece of linework through `points` under `t`; its true length in local units when it is curved or known. */
  stroke(points: Point[], t: Affine, localLength: number): void;
  /** A closed outline under `t`; its points are made only where the layer's roles keep outlines. */
  outline(points: () => Point[], t: Affine): void;
  text(at: Point, t: Affine, text: string, localHeight: number): void;
  point(at: Point, t: Affine): void;
  /** A round symbol (a circle drawn alone may be a head of an exploded drawing): its centre and radius. */
  symbol(center: Point, t: Affine, localRadius: number): void;
}

export interface EntityKind<E extends EntityBase = EntityBase> {
  type: string;
  /** The shape the layer summary counts; `closedOutline` for polylines that are outlines when their closed bit is set. */
  shape: EntityShape;
  closedOutline?: boolean;
  /** What the structure scan keeps of it: the block a reference names, its array cells, a label's text range. */
  scan?: { block?: boolean; copies?: boolean; closedBit?: boolean; label?: boolean };
  /** Reads its groups (the reader stands on its first group after "0 / TYPE"; trailing records included). */
  decode(r: EntityReader, base: EntityBase): E;
  /** Hands on its world geometry (block references are expanded by the reader itself). */
  expand?(e: E, ctx: ExpandContext): void;
}
