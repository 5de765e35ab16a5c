// The design-area stage: the design basis, then the designer's drawn area(s) and the searched most demanding
// area with its runner-up, each with its shape figures and a full hydraulic calculation.

import type { Settings } from '../config/settings.js';
import { clipPolygon } from '../geometry/clip.js';
import { dot, type Point } from '../geometry/point.js';
import type { AreaHydraulics } from '../hydraulics/calculate.js';
import { calculateArea } from '../hydraulics/calculate.js';
import type { FlowingHead } from '../hydraulics/model.js';
import type { Network } from '../network/types.js';
import type { Head, Plan } from '../read/plan.js';
import type { Outline } from '../read/types.js';
import type { Coverage } from '../coverage/coverage.js';
import type { Limits } from '../basis/limits.js';
import { containsPoint, signedArea } from '../geometry/polygon.js';
import { candidatesOf, lineFamilies, type LineFamily } from './candidates.js';
import { designBasis, type DesignBasis } from '../basis/design-basis.js';
import { searchMostDemanding, type SearchOutcome } from './search.js';
import type { AreaShape } from './shape.js';
import { maxOf, minOf } from '../arrays.js';

export interface DesignAreaResult {
  source: 'drawn' | 'search';
  /** For searched areas: the most demanding one, or the runner-up. */
  rank: 'most-demanding' | 'runner-up' | null;
  headIds: string[];
  lineIds: string[];
  /** Length along the branch lines, width across them, ft; actual area = sum of the heads' S × L, ft². */
  length: number;
  width: number;
  actualArea: number;
  /** Area of the drawn outline, ft² (drawn areas only). */
  outlineArea: number | null;
  outline: Point[];
  handle: string | null;
  hydraulics: AreaHydraulics | null;
  /** Why hydraulics are missing, when they are. */
  note: string | null;
}

export interface DesignAreas {
  basis: DesignBasis;
  shape: AreaShape | null;
  spacing: number | null;
  areas: DesignAreaResult[];
  search: Omit<SearchOutcome, 'best' | 'runnerUp'> | null;
  drawnCount: number;
  notes: string[];
}

export function evaluateDesignAreas(
  plan: Plan,
  network: Network,
  coverage: Map<string, Coverage>,
  limits: Limits,
  settings: Settings,
  roomOf: (p: Point) => Outline | null,
): DesignAreas {
  const basis = designBasis(settings);
  const headById = new Map(plan.heads.map((h) => [h.id, h]));
  const areaOf = (id: string) => coverage.get(id)?.area ?? limits.maxArea;
  const flowingOf = (ids: string[]): FlowingHead[] =>
    ids.map((id) => {
      const head = headById.get(id)!;
      return { head, required: Math.max(settings.design.minHeadPressure, ((basis.density * areaOf(id)) / head.kFactor) ** 2) };
    });
  const families = lineFamilies(network, plan.heads, coverage, basis.area);
  const main = families.sort((a, b) => b.lines.length - a.lines.length)[0] ?? null;
  const notes: string[] = [];
  const out: DesignAreas = {
    basis,
    shape: main?.shape ?? null,
    spacing: main?.spacing ?? null,
    areas: [],
    search: null,
    drawnCount: plan.designAreas.length,
    notes,
  };
  const mode = settings.design.areaMode;
  const hydraulic = network.sourceNodeId !== null;
  if (!hydraulic) notes.push('no hydraulic calculation: the water source is not on the piping');
  const calc = (ids: string[]): { h: AreaHydraulics | null; note: string | null } => {
    const connected = ids.filter((id) => network.headNode[id]);
    if (!hydraulic || connected.length === 0) return { h: null, note: 'no flowing head is connected to the source' };
    try {
      return {
        h: calculateArea(network, flowingOf(connected), settings, basis.hoseAllowance),
        note: connected.length < ids.length ? 'heads not on the piping were left out' : null,
      };
    } catch (err) {
      return { h: null, note: err instanceof Error ? err.message : String(err) };
    }
  };
  if (mode !== 'search') {
    for (const outline of plan.designAreas) {
      const ids = plan.heads.filter((h) => containsPoint(outline.points, h.position)).map((h) => h.id);
      const { h, note } = calc(ids);
      out.areas.push({ ...measureDrawn(outline, ids, main, areaOf, network), rank: null, hydraulics: h, note });
    }
  }
  if (mode !== 'drawn' && main && hydraulic) {
    const candidates = candidatesOf(main, areaOf, basis.area).filter((c) => c.headIds.some((id) => network.headNode[id]));
    const connected = (ids: string[]) => ids.filter((id) => network.headNode[id]);
    try {
      const piped = candidates.map((c) => (c.headIds.every((id) => network.headNode[id]) ? c : { ...c, headIds: connected(c.headIds) }));
      const found = searchMostDemanding(network, piped, flowingOf, settings, basis.hoseAllowance);
      out.search = {
        candidates: found.candidates,
        evaluated: found.evaluated,
        screened: found.screened,
        solves: found.solves,
        pruned: found.pruned,
      };
      for (const [rank, s] of [
        ['most-demanding', found.best],
        ['runner-up', found.runnerUp],
      ] as const) {
        if (!s) continue;
        const measured = measureSearched(s.candidate.headIds, s.candidate.lineIds, main, headById, areaOf);
        // Draw the area inside the room that holds its heads (the S × L bands may reach past a wall).
        const room = roomOf(headById.get(s.candidate.headIds[0]!)!.position);
        out.areas.push({
          ...measured,
          outline: room ? clipPolygon(measured.outline, room.points) : measured.outline,
          rank,
          hydraulics: s.hydraulics,
          note: null,
        });
      }
    } catch (err) {
      notes.push(`design-area search failed: ${err instanceof Error ? err.message : String(err)}`);
    }
  } else if (mode !== 'drawn' && !main) {
    notes.push('no branch lines with heads: the design area could not be searched');
  }
  return out;
}

type Measured = Omit<DesignAreaResult, 'hydraulics' | 'note' | 'rank'>;

function measureSearched(
  ids: string[],
  lineIds: string[],
  fam: LineFamily,
  headById: Map<string, Head>,
  areaOf: (id: string) => number,
): Measured {
  const lines = fam.lines.filter((l) => lineIds.includes(l.id));
  const spacingAcross = lines.length > 1 ? Math.abs(lines[1]!.offset - lines[0]!.offset) : fam.perHead / fam.spacing;
  const bands = lines
    .map((l) => {
      const ts = l.heads.filter((h) => ids.includes(h.id)).map((h) => h.t);
      return { lo: minOf(ts) - fam.spacing / 2, hi: maxOf(ts) + fam.spacing / 2, o: l.offset };
    })
    .sort((a, b) => a.o - b.o);
  const half = spacingAcross / 2;
  const toWorld = (t: number, o: number): Point => ({ x: fam.u.x * t + fam.v.x * o, y: fam.u.y * t + fam.v.y * o });
  const outline = [
    ...bands.flatMap((b) => [toWorld(b.lo, b.o - half), toWorld(b.lo, b.o + half)]),
    ...[...bands].reverse().flatMap((b) => [toWorld(b.hi, b.o + half), toWorld(b.hi, b.o - half)]),
  ];
  const ts = ids.map((id) => dot(headById.get(id)!.position, fam.u));
  return {
    source: 'search',
    headIds: ids,
    lineIds,
    handle: null,
    outline,
    outlineArea: null,
    length: maxOf(ts) - minOf(ts) + fam.spacing,
    width: bands.length ? bands[bands.length - 1]!.o - bands[0]!.o + spacingAcross : 0,
    actualArea: ids.reduce((s, id) => s + areaOf(id), 0),
  };
}

function measureDrawn(outline: Outline, ids: string[], fam: LineFamily | null, areaOf: (id: string) => number, network: Network): Measured {
  const u = fam?.u ?? { x: 1, y: 0 };
  const v = fam?.v ?? { x: 0, y: 1 };
  const ts = outline.points.map((p) => dot(p, u));
  const os = outline.points.map((p) => dot(p, v));
  const lineIds = network.branchLines.filter((b) => b.headIds.some((h) => ids.includes(h))).map((b) => b.id);
  return {
    source: 'drawn',
    headIds: ids,
    lineIds,
    handle: outline.handle,
    outline: outline.points,
    outlineArea: Math.abs(signedArea(outline.points)),
    length: maxOf(ts) - minOf(ts),
    width: maxOf(os) - minOf(os),
    actualArea: ids.reduce((s, id) => s + areaOf(id), 0),
  };
}
