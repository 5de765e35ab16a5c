// A reviewer's first drawings, written by Debian's ezdxf (scripts/make-fixtures.py) with ezdxf's own reading as
// the ground truth (fixtures/first-contact.truth.json): heads exploded into circles, heads among furniture, light
// fixtures and dimension ticks, and an R12 drawing that states no unit.

import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { layersReport, starterConfig } from '../src/cli/layers-table.js';
import { parseSettings } from '../src/config/settings.js';
import { planFromDrawing } from '../src/read/plan.js';
import { readDrawing } from '../src/read/read-drawing.js';
import { checkText } from './support/check.js';

const truth = JSON.parse(readFileSync('fixtures/first-contact.truth.json', 'utf8'));
const bytes = (file: string) => new Uint8Array(readFileSync(`fixtures/${file}`));
const byPlace = <T extends { position: { x: number; y: number } }>(xs: T[]) =>
  [...xs].sort((a, b) => a.position.y - b.position.y || a.position.x - b.position.x);

describe('heads drawn as plain circles (an exploded drawing)', () => {
  const drawing = readDrawing(bytes(truth.exploded.file));
  const plan = planFromDrawing(drawing, parseSettings({}));

  it("the circles on the head layer are the heads: the layer is guessed, each head has its circle's handle and centre", () => {
    expect(drawing.roles.heads.layers).toEqual(['FP-HEAD']);
    expect(drawing.roles.heads.reason).toMatch(/circles ×12/);
    const heads = byPlace(plan.heads);
    expect(heads).toHaveLength(truth.exploded.heads.length);
    truth.exploded.heads.forEach((h: { handle: string; x: number; y: number }, i: number) => {
      expect(heads[i]!.handle).toBe(h.handle);
      expect(heads[i]!.position.x).toBeCloseTo(h.x, 9);
      expect(heads[i]!.position.y).toBeCloseTo(h.y, 9);
    });
  });

  it('the whole check runs on them: 12 heads on three branch lines, K from the defaults', () => {
    const r = checkText(readFileSync(`fixtures/${truth.exploded.file}`, 'utf8'));
    expect(r.report.summary.heads).toBe(12);
    expect(r.network.branchLines.map((b) => b.headIds.length)).toEqual([4, 4, 4]);
    expect(r.design.areas.some((a) => a.hydraulics)).toBe(true);
  });
});

describe('heads among furniture, light fixtures and dimension ticks', () => {
  const report = layersReport(bytes(truth.busy.file), parseSettings({}));
  const drawing = readDrawing(bytes(truth.busy.file));

  it('takes the head symbols, not the 40 chairs, 20 light fixtures or 60 ticks, and says why for each', () => {
    expect(report.roles.heads.layers).toEqual(['FP-DEVICES']);
    expect(report.headBlocks).toEqual(['SPRK-UPRIGHT']);
    const why = Object.fromEntries(report.headCandidates.map((c) => [c.layer, c]));
    expect(why['FP-DEVICES']).toMatchObject({ taken: true, block: 'SPRK-UPRIGHT', count: 12 });
    expect(why['FP-DEVICES']!.why).toMatch(/K attribute/);
    // 22 in and 48 in across by ezdxf's bounding boxes: past the 3 ft of a head symbol only the light is; the chair
    // is turned down by its name, the tick by its size (0.1 in)
    expect(why['I-FURN']).toMatchObject({ taken: false });
    expect(why['I-FURN']!.why).toMatch(/name says something else/);
    expect(why['E-LITE']!.why).toMatch(/furniture-sized/);
    expect(why['A-ANNO-DIMS']!.why).toMatch(/too small for a head symbol/);
  });

  it("block sizes are ezdxf's bounding boxes, counts per layer are ezdxf's", () => {
    for (const layer of report.layers) {
      for (const b of layer.blocks) if (b.name in truth.busy.blockSizes) expect(b.size).toBeCloseTo(truth.busy.blockSizes[b.name], 6);
      expect(layer.entities).toEqual(truth.busy.layers[layer.name] ?? {});
    }
  });

  it("the heads are ezdxf's SPRK-UPRIGHT references, with their handles and positions", () => {
    const plan = planFromDrawing(drawing, parseSettings({}));
    const heads = byPlace(plan.heads);
    expect(heads.map((h) => h.handle)).toEqual(truth.busy.heads.map((h: { handle: string }) => h.handle));
    truth.busy.heads.forEach((h: { x: number; y: number }, i: number) => {
      expect(heads[i]!.position).toEqual({ x: h.x, y: h.y });
    });
  });

  it('the starter config it writes runs the check unchanged, with the same roles', () => {
    const config = starterConfig(report, truth.busy.file);
    expect(config).toMatchObject({
      units: 'in',
      layers: { heads: ['FP-DEVICES'], pipes: ['FP-PIPE'], walls: ['A-WALL'], source: ['FP-SOURCE'] },
      headBlocks: ['SPRK-UPRIGHT'],
    });
    const r = checkText(readFileSync(`fixtures/${truth.busy.file}`, 'utf8'), JSON.parse(JSON.stringify(config)));
    expect(r.report.summary.heads).toBe(12);
    expect(r.report.input.layersUsed.heads).toEqual(['FP-DEVICES']);
  });
});

describe('a drawing that states no unit (R12)', () => {
  it("layers works in drawing units: ezdxf reads no $INSUNITS, counts per layer are ezdxf's", () => {
    expect(truth.noUnit.insunits).toBeNull();
    const report = layersReport(bytes(truth.noUnit.file), parseSettings({}));
    expect(report.units).toBeNull();
    for (const layer of report.layers) expect(layer.entities).toEqual(truth.noUnit.layers[layer.name] ?? {});
    const spk = report.layers.find((l) => l.name === 'FP-HEAD')!.blocks.find((b) => b.name === 'SPK')!;
    expect(spk.size).toBeCloseTo(6, 9); // a 3 in radius circle: 6 drawing units across
    expect(spk.sizeInches).toBeNull();
    expect(starterConfig(report, truth.noUnit.file).comment).toMatch(/states no unit/);
  });
  it('with a unit given, sizes are in inches too', () => {
    const report = layersReport(bytes(truth.noUnit.file), parseSettings({ units: 'in' }));
    expect(report.layers.find((l) => l.name === 'FP-HEAD')!.blocks.find((b) => b.name === 'SPK')!.sizeInches).toBe(6);
  });
});
