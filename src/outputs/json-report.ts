// The report JSON of the contract: every top-level key always present, values converted to the chosen
// unit system, numbers rounded to a stated precision so reports are stable byte for byte.

import { PRESSURE_BASIS, type PressureBasis } from '../hydraulics/velocity-pressure.js';
import { LAYER_ROLES, type LayerRole } from '../config/settings.js';
import type { Point } from '../geometry/point.js';
import type { PipeRole } from '../network/types.js';
import { converterFor, REPORT_UNITS, type ReportUnits } from '../quantities/convert.js';
import { formatterFor } from '../quantities/format.js';
import { messageOf } from '../rules/messages.js';
import type { Quantity, Severity } from '../rules/types.js';
import { TOOL } from '../version.js';
import { CAUTION } from './caution.js';
import type { Limits } from '../basis/limits.js';
import type { SearchStats } from '../design-area/evaluate.js';
import type { CalculationStep, FlowingHeadResult } from '../hydraulics/calculate.js';
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
    /** The file's format; a DWG is read through its DXF conversion (`dxfVersion` is the conversion's). */
    format: 'dxf' | 'dwg';
    dwgVersion: string | null;
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
    /** The searches of every group, added up. */
    search: SearchStats | null;
    /** One design-area search per system, and per zone within it. */
    groups: {
      system: string;
      zone: string | null;
      zoneId: string | null;
      hazard: string;
      density: number;
      area: number;
      hoseAllowance: number;
      heads: number;
      minLength: number | null;
      headsAlong: number | null;
      totalHeads: number | null;
      search: SearchStats | null;
    }[];
  };
  summary: { heads: number; pipes: number; systems: number; zones: number; errors: number; warnings: number; pass: boolean };
  network: {
    systems: {
      id: string;
      sourceNode: string;
      sharedSources: string[];
      heads: number;
      pipes: number;
      branchLines: string[];
      topology: string;
      loops: number;
    }[];
    branchLines: { id: string; heads: string[]; pipes: string[] }[];
  };
  layers: { role: LayerRole; layers: string[]; from: string; reason: string }[];
  /** The limits of the configured design (heads in no zone). */
  limits: ReportLimits;
  zones: {
    id: string;
    label: string | null;
    handle: string;
    pattern: string | null;
    hazard: string;
    density: number;
    area: number;
    hoseAllowance: number;
    heads: string[];
    limits: ReportLimits;
  }[];
  caution: string;
}

interface ReportLimits {
  edition: string;
  hazardGroup: string;
  maxArea: number;
  maxSpacing: number;
  maxWallDistance: number;
  minWallDistance: number;
  minHeadDistance: number;
}

export interface ReportDesignArea {
  source: 'drawn' | 'search';
  rank: 'most-demanding' | 'runner-up' | null;
  /** The system (its source's handle) and the zone (its label) the area belongs to. */
  system: string | null;
  zone: string | null;
  zoneId: string | null;
  hazard: string;
  density: number;
  area: number;
  minLength: number | null;
  length: number;
  width: number;
  actualArea: number;
  heads: string[];
  headIds: string[];
  branchLines: string[];
  /** The outline's rings (two where the leftover heads lie apart from the rectangle). */
  outline: { x: number; y: number }[][];
  /** Sum of the heads' S × L (actualArea is the floor the outline encloses). */
  coveredArea: number;
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
    /** Handle of the head that sets the pressure. */
    controllingHead: string;
    /** In the report's units, as the calculation has them. */
    steps: CalculationStep[];
    /** The supply path at the total demand, from the flow-test point to the source (empty without a path). */
    supplyPath: { part: number; type: string; name: string; flow: number; loss: number; pressureFrom: number; pressureTo: number }[];
    heads: FlowingHeadResult[];
    riser: { modelled: string; length: number; nominalSize: string };
    /** Which pressure the heads flow at, and how, in words. */
    pressureBasis: { basis: PressureBasis; method: string };
    handMethod: { sourcePressure: number; sourceFlow: number } | null;
    nodes: { id: string; pressure: number; flow: number; elevation: number }[];
    pipes: { id: string; flow: number; velocity: number; frictionLoss: number; equivalentLength: number; fittings: string[] }[];
  };
}

/** What the report is made of: the reviewed drawing (before its report) and the hash of its bytes. */
export type ReportInput = Omit<Reviewed, 'report' | 'bytes'> & { sha256: string; dwgVersion?: string | null };

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
      format: r.dwgVersion ? 'dwg' : 'dxf',
      dwgVersion: r.dwgVersion ?? null,
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
    design: designOf(r, c),
    summary: {
      heads: r.plan.heads.length,
      pipes: r.network.pipes.length,
      systems: r.network.systems.length,
      zones: r.zoning.zones.length,
      errors: findings.filter((f) => f.severity === 'error').length,
      warnings: findings.filter((f) => f.severity === 'warning').length,
      pass: !findings.some((f) => f.severity === 'error'),
    },
    network: {
      systems: r.network.systems.map((s) => ({
        id: s.id,
        sourceNode: s.sourceNodeId,
        sharedSources: s.sharedSourceHandles,
        heads: s.headIds.length,
        pipes: s.pipeIds.length,
        branchLines: s.branchLineIds,
        topology: s.topology,
        loops: s.loops,
      })),
      branchLines: r.network.branchLines.map((b) => ({ id: b.id, heads: b.headIds, pipes: b.pipeIds })),
    },
    layers: LAYER_ROLES.map((role) => ({ role, ...r.plan.roles[role] })),
    limits: limitsOf(r.zoning.design.limits, c),
    zones: r.zoning.zones.map((z) => ({
      id: z.id,
      label: z.label,
      handle: z.handle,
      pattern: z.pattern,
      hazard: z.hazard,
      density: round(c.density(z.design.density), 5),
      area: round(c.area(z.design.area)),
      hoseAllowance: round(c.flow(z.design.hoseAllowance)),
      heads: z.headIds,
      limits: limitsOf(z.limits, c),
    })),
    caution: CAUTION,
  };
}

type Converter = ReturnType<typeof converterFor>;

function limitsOf(l: Limits, c: Converter): ReportLimits {
  return {
    edition: l.edition,
    hazardGroup: l.hazardGroup,
    maxArea: round(c.area(l.maxArea)),
    maxSpacing: round(c.length(l.maxSpacing)),
    maxWallDistance: round(c.length(l.maxWallDistance)),
    minWallDistance: round(c.length(l.minWallDistance)),
    minHeadDistance: round(c.length(l.minHeadDistance)),
  };
}

/** The configured design, the shape of its first search, and every search's figures. */
function designOf(r: ReportInput, c: Converter): Report['design'] {
  const basis = r.zoning.design.design;
  const groups = r.design.groups;
  const first = groups.find((g) => g.zone === null) ?? groups[0];
  const searches = groups.flatMap((g) => (g.search ? [g.search] : []));
  const labelOf = (zone: string | null) => (zone === null ? null : (r.zoning.zones.find((z) => z.id === zone)!.label ?? zone));
  return {
    hazard: basis.hazard,
    density: round(c.density(basis.density), 5),
    area: round(c.area(basis.area)),
    baseArea: round(c.area(basis.baseArea)),
    hoseAllowance: round(c.flow(basis.hoseAllowance)),
    durationMinutes: basis.durationMinutes,
    adjustments: basis.adjustments,
    basisFrom: basis.source,
    minLength: first?.shape ? round(c.length(first.shape.minLength)) : null,
    headsAlong: first?.shape?.headsAlong ?? null,
    totalHeads: first?.shape?.totalHeads ?? null,
    search: searches.length
      ? {
          candidates: searches.reduce((n, s) => n + s.candidates, 0),
          evaluated: searches.reduce((n, s) => n + s.evaluated, 0),
          screened: searches.reduce((n, s) => n + s.screened, 0),
          solves: searches.reduce((n, s) => n + s.solves, 0),
          pruned: searches.every((s) => s.pruned),
        }
      : null,
    groups: groups.map((g) => ({
      system: g.system,
      zone: labelOf(g.zone),
      zoneId: g.zone,
      hazard: g.basis.hazard,
      density: round(c.density(g.basis.density), 5),
      area: round(c.area(g.basis.area)),
      hoseAllowance: round(c.flow(g.basis.hoseAllowance)),
      heads: g.headIds.length,
      minLength: g.shape ? round(c.length(g.shape.minLength)) : null,
      headsAlong: g.shape?.headsAlong ?? null,
      totalHeads: g.shape?.totalHeads ?? null,
      search: g.search,
    })),
  };
}

function designAreasOf(r: ReportInput, c: Converter): ReportDesignArea[] {
  const handleOf = new Map(r.plan.heads.map((h) => [h.id, h.handle]));
  return r.design.areas.map((a) => {
    const h = a.hydraulics;
    const zone = a.zone === null ? null : r.zoning.zones.find((z) => z.id === a.zone)!;
    return {
      source: a.source,
      rank: a.rank,
      system: a.system,
      zone: zone ? (zone.label ?? zone.id) : null,
      zoneId: a.zone,
      hazard: a.basis.hazard,
      density: round(c.density(a.basis.density), 5),
      area: round(c.area(a.basis.area)),
      minLength: a.shape ? round(c.length(a.shape.minLength)) : null,
      length: round(c.length(a.length)),
      width: round(c.length(a.width)),
      actualArea: round(c.area(a.actualArea)),
      heads: [...new Set(a.headIds.map((id) => handleOf.get(id)!))],
      headIds: a.headIds,
      branchLines: a.lineIds,
      outline: a.outline.map((ring) => ring.map((p) => ({ x: round(c.length(p.x)), y: round(c.length(p.y)) }))),
      coveredArea: round(c.area(a.coveredArea)),
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
        controllingHead: h.controllingHead,
        steps: h.steps.map((x) => ({
          pipe: x.pipe,
          from: x.from,
          to: x.to,
          nominalSize: x.nominalSize,
          innerDiameter: round(c.diameter(x.innerDiameter), 3),
          length: round(c.length(x.length)),
          fittingsLength: round(c.length(x.fittingsLength)),
          fittings: x.fittings,
          cFactor: x.cFactor,
          flow: round(c.flow(x.flow)),
          frictionPerLength: round(c.pressure(x.frictionPerLength) / c.length(1), 6),
          friction: round(c.pressure(x.friction)),
          elevationChange: round(c.pressure(x.elevationChange)),
          sideOutletDeduction: round(c.pressure(x.sideOutletDeduction)),
          pressureFrom: round(c.pressure(x.pressureFrom)),
          pressureTo: round(c.pressure(x.pressureTo)),
          velocity: round(c.velocity(x.velocity)),
        })),
        supplyPath: h.supplyPath.map((x) => ({
          part: x.part,
          type: x.type,
          name: x.name,
          flow: round(c.flow(x.flow)),
          loss: round(c.pressure(x.loss)),
          pressureFrom: round(c.pressure(x.pressureFrom)),
          pressureTo: round(c.pressure(x.pressureTo)),
        })),
        heads: h.heads.map((x) => ({
          handle: x.handle,
          node: x.node,
          kFactor: round(c.kFactor(x.kFactor), 3),
          requiredPressure: round(c.pressure(x.requiredPressure)),
          pressure: round(c.pressure(x.pressure)),
          velocityPressure: round(c.pressure(x.velocityPressure)),
          normalPressure: round(c.pressure(x.normalPressure)),
          flow: round(c.flow(x.flow)),
        })),
        riser: { modelled: h.riser.modelled, length: round(c.length(h.riser.length)), nominalSize: h.riser.nominalSize },
        pressureBasis: { basis: h.pressureBasis, method: PRESSURE_BASIS[h.pressureBasis] },
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
