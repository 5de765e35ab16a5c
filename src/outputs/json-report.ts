// The report JSON of the contract: every top-level key always present, values converted to the chosen
// unit system, numbers rounded to a stated precision so reports are stable byte for byte.

import { LAYER_ROLES, type LayerRole } from '../config/settings.js';
import type { Point } from '../geometry/point.js';
import type { PipeRole } from '../network/types.js';
import { converterFor, REPORT_UNITS, type ReportUnits } from '../quantities/convert.js';
import { formatterFor } from '../quantities/format.js';
import { messageOf } from '../rules/messages.js';
import type { Quantity, Severity } from '../rules/types.js';
import { TOOL } from '../version.js';
import { CAUTION } from './caution.js';
import type { Reviewed } from './reviewed.js';

export interface ReportFinding {
  rule: string;
  severity: Severity;
  message: string;
  handles: string[];
  at: { x: number; y: number };
  measured: number | null;
  limit: number | null;
  reference: string;
}

export interface Report {
  tool: { name: string; version: string };
  input: {
    file: string;
    sha256: string;
    drawingUnits: string;
    layersUsed: Record<LayerRole, string[]>;
    dxfVersion: string;
    encoding: string;
  };
  units: ReportUnits;
  heads: {
    id: string;
    handle: string;
    x: number;
    y: number;
    kFactor: number;
    elevation: number;
    coverage: { s: number | null; l: number | null; area: number | null };
    branchLine: string | null;
  }[];
  pipes: {
    id: string;
    handles: string[];
    from: string;
    to: string;
    length: number;
    nominalSize: string;
    innerDiameter: number;
    cFactor: number;
    role: PipeRole;
  }[];
  findings: ReportFinding[];
  designAreas: ReportDesignArea[];
  design: {
    hazard: string;
    density: number;
    area: number;
    baseArea: number;
    hoseAllowance: number;
    durationMinutes: number;
    adjustments: string[];
    basisFrom: string;
    minLength: number | null;
    headsAlong: number | null;
    totalHeads: number | null;
    search: { candidates: number; evaluated: number; screened: number; solves: number; pruned: boolean } | null;
  };
  summary: { heads: number; pipes: number; errors: number; warnings: number; pass: boolean };
  network: { topology: string; loops: number; branchLines: { id: string; heads: string[]; pipes: string[] }[]; source: string | null };
  layers: { role: LayerRole; layers: string[]; from: string; reason: string }[];
  limits: {
    edition: string;
    hazardGroup: string;
    maxArea: number;
    maxSpacing: number;
    maxWallDistance: number;
    minWallDistance: number;
    minHeadDistance: number;
  };
  caution: string;
}

export interface ReportDesignArea {
  source: 'drawn' | 'search';
  rank: 'most-demanding' | 'runner-up' | null;
  density: number;
  area: number;
  minLength: number | null;
  length: number;
  width: number;
  actualArea: number;
  heads: string[];
  headIds: string[];
  branchLines: string[];
  outline: { x: number; y: number }[];
  handle: string | null;
  note: string | null;
  hydraulics: null | {
    sourcePressure: number;
    sourceFlow: number;
    hoseAllowance: number;
    totalDemand: number;
    supplyAvailable: number | null;
    margin: number | null;
    criticalHead: string;
    riser: { modelled: string; length: number; nominalSize: string };
    handMethod: { sourcePressure: number; sourceFlow: number } | null;
    nodes: { id: string; pressure: number; flow: number; elevation: number }[];
    pipes: { id: string; flow: number; velocity: number; frictionLoss: number; equivalentLength: number; fittings: string[] }[];
  };
}

/** What the report is made of: the reviewed drawing (before its report) and the hash of its bytes. */
export type ReportInput = Omit<Reviewed, 'report' | 'bytes'> & { sha256: string };

/** Rounds to `digits` decimals, keeping -0 out of the output. */
export const round = (v: number, digits = 4): number => {
  const f = 10 ** digits;
  const r = Math.round(v * f) / f;
  return r === 0 ? 0 : r;
};
const roundOrNull = (v: number | null, digits = 4) => (v === null ? null : round(v, digits));

export function buildReport(r: ReportInput): Report {
  const c = converterFor(r.reportUnits);
  const fmt = formatterFor(r.reportUnits);
  const len = (v: number) => round(c.length(v));
  const at = (p: Point) => ({ x: len(p.x), y: len(p.y) });
  const headLine = new Map<string, string>();
  for (const b of r.network.branchLines) for (const h of b.headIds) headLine.set(h, b.id);
  const quantity = (q: Quantity, v: number | null): number | null => {
    if (v === null) return null;
    switch (q) {
      case 'length':
        return round(c.length(v));
      case 'area':
        return round(c.area(v));
      case 'flow':
        return round(c.flow(v));
      case 'pressure':
        return round(c.pressure(v));
      case 'kFactor':
        return round(c.kFactor(v));
      case 'density':
        return round(c.density(v), 5);
      default:
        return round(v);
    }
  };
  const findings = r.findings.map((f) => ({
    rule: f.rule,
    severity: f.severity,
    message: messageOf(f, fmt),
    handles: f.handles,
    at: at(f.at),
    measured: quantity(f.quantity, f.measured),
    limit: quantity(f.quantity, f.limit),
    reference: f.reference,
  }));
  const layersUsed = Object.fromEntries(LAYER_ROLES.map((role) => [role, r.plan.roles[role].layers])) as Record<LayerRole, string[]>;
  return {
    tool: { name: TOOL.name, version: TOOL.version },
    input: {
      file: r.fileName,
      sha256: r.sha256,
      drawingUnits: r.drawing.units,
      layersUsed,
      dxfVersion: r.drawing.version,
      encoding: r.drawing.encoding,
    },
    units: REPORT_UNITS[r.reportUnits],
    heads: r.plan.heads.map((h) => {
      const cov = r.coverage.get(h.id);
      return {
        id: h.id,
        handle: h.handle,
        x: len(h.position.x),
        y: len(h.position.y),
        kFactor: round(c.kFactor(h.kFactor), 3),
        elevation: len(h.elevation),
        coverage: {
          s: roundOrNull(cov?.s == null ? null : c.length(cov.s)),
          l: roundOrNull(cov?.l == null ? null : c.length(cov.l)),
          area: roundOrNull(cov?.area == null ? null : c.area(cov.area)),
        },
        branchLine: headLine.get(h.id) ?? null,
      };
    }),
    pipes: r.network.pipes.map((p) => ({
      id: p.id,
      handles: p.handles,
      from: p.from,
      to: p.to,
      length: len(p.length),
      nominalSize: p.nominalSize,
      innerDiameter: round(c.diameter(p.innerDiameter), 3),
      cFactor: p.cFactor,
      role: p.role,
    })),
    findings,
    designAreas: designAreasOf(r, c),
    design: {
      hazard: r.design.basis.hazard,
      density: round(c.density(r.design.basis.density), 5),
      area: round(c.area(r.design.basis.area)),
      baseArea: round(c.area(r.design.basis.baseArea)),
      hoseAllowance: round(c.flow(r.design.basis.hoseAllowance)),
      durationMinutes: r.design.basis.durationMinutes,
      adjustments: r.design.basis.adjustments,
      basisFrom: r.design.basis.source,
      minLength: r.design.shape ? len(r.design.shape.minLength) : null,
      headsAlong: r.design.shape?.headsAlong ?? null,
      totalHeads: r.design.shape?.totalHeads ?? null,
      search: r.design.search,
    },
    summary: {
      heads: r.plan.heads.length,
      pipes: r.network.pipes.length,
      errors: findings.filter((f) => f.severity === 'error').length,
      warnings: findings.filter((f) => f.severity === 'warning').length,
      pass: !findings.some((f) => f.severity === 'error'),
    },
    network: {
      topology: r.network.topology,
      loops: r.network.loops,
      source: r.network.sourceNodeId,
      branchLines: r.network.branchLines.map((b) => ({ id: b.id, heads: b.headIds, pipes: b.pipeIds })),
    },
    layers: LAYER_ROLES.map((role) => ({ role, ...r.plan.roles[role] })),
    limits: {
      edition: r.limits.edition,
      hazardGroup: r.limits.hazardGroup,
      maxArea: round(c.area(r.limits.maxArea)),
      maxSpacing: len(r.limits.maxSpacing),
      maxWallDistance: len(r.limits.maxWallDistance),
      minWallDistance: len(r.limits.minWallDistance),
      minHeadDistance: len(r.limits.minHeadDistance),
    },
    caution: CAUTION,
  };
}

function designAreasOf(r: ReportInput, c: ReturnType<typeof converterFor>): ReportDesignArea[] {
  const handleOf = new Map(r.plan.heads.map((h) => [h.id, h.handle]));
  const basis = r.design.basis;
  return r.design.areas.map((a) => {
    const h = a.hydraulics;
    return {
      source: a.source,
      rank: a.rank,
      density: round(c.density(basis.density), 5),
      area: round(c.area(basis.area)),
      minLength: r.design.shape ? round(c.length(r.design.shape.minLength)) : null,
      length: round(c.length(a.length)),
      width: round(c.length(a.width)),
      actualArea: round(c.area(a.actualArea)),
      heads: [...new Set(a.headIds.map((id) => handleOf.get(id)!))],
      headIds: a.headIds,
      branchLines: a.lineIds,
      outline: a.outline.map((p) => ({ x: round(c.length(p.x)), y: round(c.length(p.y)) })),
      handle: a.handle,
      note: a.note,
      hydraulics: h && {
        sourcePressure: round(c.pressure(h.sourcePressure)),
        sourceFlow: round(c.flow(h.sourceFlow)),
        hoseAllowance: round(c.flow(h.hoseAllowance)),
        totalDemand: round(c.flow(h.totalDemand)),
        supplyAvailable: h.supplyAvailable === null ? null : round(c.pressure(h.supplyAvailable)),
        margin: h.margin === null ? null : round(c.pressure(h.margin)),
        criticalHead: h.criticalHeadId,
        riser: { modelled: h.riser.modelled, length: round(c.length(h.riser.length)), nominalSize: h.riser.nominalSize },
        handMethod: h.handMethod && {
          sourcePressure: round(c.pressure(h.handMethod.sourcePressure)),
          sourceFlow: round(c.flow(h.handMethod.sourceFlow)),
        },
        nodes: h.nodes.map((n) => ({
          id: n.id,
          pressure: round(c.pressure(n.pressure)),
          flow: round(c.flow(n.flow)),
          elevation: round(c.length(n.elevation)),
        })),
        pipes: h.pipes.map((p) => ({
          id: p.id,
          flow: round(c.flow(p.flow)),
          velocity: round(c.velocity(p.velocity)),
          frictionLoss: round(c.pressure(p.frictionLoss)),
          equivalentLength: round(c.length(p.length)),
          fittings: p.fittings,
        })),
      },
    };
  });
}
