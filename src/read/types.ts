// Plain data produced by the read stage: the drawing's model-space content in world coordinates (feet).
// Every item keeps the handle of the top-level entity a reviewer would select in CAD.

import type { Point } from '../geometry/point.js';
import type { HeadCandidate, LayerRoles } from './layer-roles.js';
import type { EntityHandles } from './source.js';

import type { LengthUnit } from '../config/settings.js';

export type { LengthUnit };

/** A block reference after expansion, at any nesting depth. */
export interface BlockRef {
  handle: string;
  /** Effective layer (a nested entity on layer 0 takes its parent reference's layer). */
  layer: string;
  block: string;
  /** World position of the insertion point, feet. */
  position: Point;
  /** World rotation of the block's x axis, degrees. */
  rotationDeg: number;
  mirrored: boolean;
  /** Attribute values by upper-case tag. */
  attributes: Record<string, string>;
  /** Block names from the top-level reference down to this one (empty for a top-level reference). */
  parents: string[];
  /** True when this reference's block itself contains block references. */
  hasNestedRefs: boolean;
}

/** A straight or curved piece of linework, feet. Arcs carry sample points between their ends. */
export interface Stroke {
  handle: string;
  layer: string;
  type: string;
  a: Point;
  b: Point;
  /** Interior points of a curved piece, in order from a to b (empty for a straight one). */
  via: Point[];
  /** True length along the piece. */
  length: number;
}

/** A closed outline (closed polyline or circle), feet. */
export interface Outline {
  handle: string;
  layer: string;
  type: string;
  points: Point[];
}

export interface TextItem {
  handle: string;
  layer: string;
  position: Point;
  /** Plain text, formatting codes removed. */
  text: string;
  height: number;
}

export interface PointItem {
  handle: string;
  layer: string;
  position: Point;
}

/** A circle or point drawn on its own (not inside a block): on a head layer without head blocks, a head. */
export interface SymbolItem extends PointItem {
  type: 'CIRCLE' | 'POINT';
  /** Radius, feet (0 for a point). */
  radius: number;
}

export interface LayerSummary {
  name: string;
  /** Model-space entity counts by DXF type, block contents counted per reference. */
  counts: Record<string, number>;
  /** References to each block placed on the layer, through nesting and arrays, by block name. */
  blockRefs: Record<string, number>;
  /** The same for blocks that hold no further references (a symbol, such as a head). */
  symbolRefs: Record<string, number>;
  /** Block references, pieces of linework (lines, arcs, polylines), closed outlines and points. */
  refs: number;
  strokes: number;
  outlines: number;
  points: number;
}

/** Everything the later stages read: every layer summarized, the content of the layers that play a role. */
/** What is said of a drawing beside its geometry: what the reports state and what the annotator needs. */
export interface DrawingFacts {
  version: string;
  units: LengthUnit;
  /** Where the units came from. */
  unitsFrom: 'config' | 'header';
  /** What the header's $INSUNITS says, when it names a unit. */
  headerUnits: LengthUnit | null;
  encoding: string;
  handseed: string | null;
  /** Where the entity sections lie and the highest handle in them, for the annotated drawing. */
  entityHandles: EntityHandles;
  layers: LayerSummary[];
  /** Which layers hold heads, pipes, walls, design areas and the source; only their content is read below. */
  roles: LayerRoles;
  /** Each layer's best head symbol as the guess weighed it (empty when the config names the head layers). */
  headCandidates: HeadCandidate[];
}

export interface Drawing extends DrawingFacts {
  refs: BlockRef[];
  strokes: Stroke[];
  outlines: Outline[];
  texts: TextItem[];
  points: PointItem[];
  symbols: SymbolItem[];
}
