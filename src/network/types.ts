// Plain data of the rebuilt piping network: nodes, pipes with sizes and roles, branch lines, topology,
// and what could not be connected. Lengths in feet, diameters in inches.

import type { Point } from '../geometry/point.js';
import type { NominalSize } from '../quantities/pipe-sizes.js';

export type PipeRole = 'branch' | 'cross-main' | 'feed-main' | 'riser' | 'drop' | 'unknown';

export interface NetNode {
  id: string;
  position: Point;
  /** Head attached at this node, if any. */
  headId?: string;
  isSource: boolean;
}

export interface NetPipe {
  id: string;
  from: string;
  to: string;
  /** Handles of the drawn entities this pipe was built from. */
  handles: string[];
  /** Plan points from `from` to `to`. */
  points: Point[];
  length: number;
  /** Direction changes along the pipe of more than 30° (elbows). */
  bends: number;
  nominalSize: NominalSize;
  sizeFrom: 'label' | 'default';
  /** Labels beside the pipe that read like sizes but name none (`99"`), as written. */
  unreadLabels: string[];
  innerDiameter: number;
  cFactor: number;
  role: PipeRole;
  /** Index of the straight run the pipe belongs to. */
  run: number;
}

export interface BranchLine {
  id: string;
  pipeIds: string[];
  /** Heads on the line, ordered from the end nearest the feed outward. */
  headIds: string[];
  /** Unit vector along the line. */
  direction: Point;
  /** Nodes where the line meets a main. */
  feedNodeIds: string[];
}

export type Topology = 'tree' | 'loop' | 'grid';

export interface DisconnectedPart {
  pipeIds: string[];
  headIds: string[];
  handles: string[];
  at: Point;
}

/** The piping one source (riser) feeds: everything connected to it. */
export interface NetSystem {
  /** Handle of the source symbol: the system's name in reports. */
  id: string;
  sourceNodeId: string;
  /** Handles of further sources drawn on the same piping (the system is calculated from the first). */
  sharedSourceHandles: string[];
  nodeIds: string[];
  pipeIds: string[];
  /** Heads on this system's piping, in drawing order. */
  headIds: string[];
  branchLineIds: string[];
  topology: Topology;
  /** Independent loops (pipes − nodes + 1). */
  loops: number;
}

export interface Network {
  nodes: NetNode[];
  pipes: NetPipe[];
  branchLines: BranchLine[];
  /** Head id to node id. */
  headNode: Record<string, string>;
  /** One per source on the piping, in the order the sources were drawn. */
  systems: NetSystem[];
  /** Handles of sources on no pipe. */
  unattachedSourceHandles: string[];
  unattachedHeadIds: string[];
  /** Piping no source feeds. */
  disconnected: DisconnectedPart[];
}
