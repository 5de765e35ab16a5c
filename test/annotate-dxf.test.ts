// The annotated drawing: every original entity, layer, block and handle kept byte for byte, annotations on
// HC- layers with fresh handles above $HANDSEED; checked by our reader, by ezdxf's audit (Debian
// python3-ezdxf) and by LibreCAD's dxf2pdf as a real CAD client (rendered page must show the annotations).

import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { FORMATS } from '../src/check/formats.js';
import { runCheck } from '../src/check/run-check.js';
import { parseSettings } from '../src/config/settings.js';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { layoutDxf } from '../src/demo/generated-layout.js';
import { ANNOTATION_COLORS } from '../src/outputs/annotations.js';
import { GroupCursor } from '../src/read/dxf/groups.js';
import { readDrawing } from '../src/read/read-drawing.js';
import { describeWith, hasEzdxf, SYSTEM_PYTHON } from './support/external.js';
import { canRender, inkShare, renderPdf } from './support/render.js';

const cases: { name: string; bytes: Uint8Array; config: Record<string, unknown> }[] = [
  { name: 'bay2-r12', bytes: new Uint8Array(readFileSync('fixtures/bay2-r12.dxf')), config: { units: 'in' } },
  { name: 'bay2-r2000', bytes: new Uint8Array(readFileSync('fixtures/bay2-r2000.dxf')), config: {} },
  { name: 'bay2-r2018', bytes: new Uint8Array(readFileSync('fixtures/bay2-r2018.dxf')), config: {} },
  { name: 'demo', bytes: new TextEncoder().encode(demoDrawing()), config: DEMO_CONFIG as unknown as Record<string, unknown> },
];

function annotate(c: (typeof cases)[number]) {
  const input = { bytes: c.bytes, fileName: `${c.name}.dxf`, sha256: '', settings: parseSettings(c.config), reportUnits: 'us' as const };
  const result = runCheck(input);
  return { result, out: new Uint8Array(Buffer.concat(FORMATS.dxf.make(result))) };
}

/** Every group's code and value, read by our own group walker. */
const groupsOf = (bytes: Uint8Array) => {
  const c = new GroupCursor(bytes);
  const out: { code: number; value: string }[] = [];
  while (c.next()) out.push({ code: c.code, value: c.latin1() });
  return out;
};
const entitiesText = (bytes: Uint8Array) => {
  const v = new TextDecoder('latin1').decode(bytes);
  const start = v.search(/\r?\n\s*2\r?\nENTITIES\r?\n/);
  return v.slice(start, v.indexOf('\nENDSEC', start));
};
/** Entity and table handles (group 5 outside the HEADER section, where $HANDSEED also uses code 5). */
const handlesOf = (bytes: Uint8Array) => {
  const groups = groupsOf(bytes);
  const headerEnd = groups.findIndex((g) => g.code === 0 && g.value === 'ENDSEC');
  return groups.filter((g, i) => i > headerEnd && g.code === 5 && /^[0-9A-F]+$/i.test(g.value)).map((g) => BigInt(`0x${g.value}`));
};
const seedOf = (bytes: Uint8Array) => {
  const g = groupsOf(bytes);
  const i = g.findIndex((x) => x.code === 9 && x.value === '$HANDSEED');
  return BigInt(`0x${g[i + 1]!.value}`);
};

describe.each(cases)('annotated $name', (c) => {
  const { result, out } = annotate(c);
  const units = c.config['units'] as 'in' | undefined;

  it('keeps the original model space byte for byte and appends to it', () => {
    const before = entitiesText(c.bytes);
    const after = entitiesText(out);
    expect(after.startsWith(before.slice(0, before.lastIndexOf('\n')))).toBe(true);
    expect(after.length).toBeGreaterThan(before.length);
  });

  it('reads back with the same original entities plus annotations on HC- layers only', () => {
    const a = readDrawing(c.bytes, units ? { units } : {});
    const b = readDrawing(out, units ? { units } : {});
    const original = (d: typeof a) => [...d.refs, ...d.strokes, ...d.texts].filter((x) => !x.layer.startsWith('HC-') && x.handle !== '');
    const sig = (d: typeof a) =>
      original(d)
        .map((x) => `${x.handle}|${x.layer}`)
        .sort();
    // The legend block's contents sit on layer 0 inside a reference on HC-LEGEND; they take that layer.
    expect(sig(b)).toEqual(sig(a));
    const added = [...b.strokes, ...b.texts, ...b.outlines, ...b.refs].filter((x) => x.layer.startsWith('HC-'));
    expect(added.length).toBeGreaterThan(result.findings.length);
    expect(new Set(b.layers.map((l) => l.name))).toEqual(
      new Set([...a.layers.map((l) => l.name), 'HC-FINDINGS', 'HC-DESIGN-AREA', 'HC-HEAD-TAGS', 'HC-PIPE-TAGS', 'HC-ZONES', 'HC-LEGEND']),
    );
  });

  it('gives new entities fresh handles above the old seed and moves $HANDSEED past them', () => {
    const old = new Set(handlesOf(c.bytes));
    const all = handlesOf(out);
    expect(new Set(all).size).toBe(all.length); // every handle unique
    const fresh = all.filter((h) => !old.has(h));
    expect(fresh.length).toBeGreaterThan(result.findings.length);
    const oldSeed = seedOf(c.bytes);
    expect(fresh.every((h) => h >= oldSeed)).toBe(true);
    const newSeed = seedOf(out);
    expect(all.every((h) => h < newSeed)).toBe(true);
  });
});

describeWith('python3-ezdxf', hasEzdxf(), 'annotated drawings in ezdxf', () => {
  it('read and audit clean: no error; only the fix ezdxf 0.18 makes to its own R12 loads', () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-audit-'));
    const files = cases.map((c) => {
      const f = join(dir, `${c.name}.dxf`);
      writeFileSync(f, annotate(c).out);
      return f;
    });
    const r = spawnSync(SYSTEM_PYTHON, ['scripts/ezdxf-audit.py', ...files], { encoding: 'utf8', timeout: 120_000 });
    expect(r.status, r.stderr).toBe(0);
    const reports = r.stdout
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    for (const rep of reports) {
      expect(rep.readError).toBeUndefined();
      expect(rep.errors).toEqual([]);
      // ezdxf 0.18 invents SEQENDs when it loads R12 polylines and attributes, then deletes them in audit; it does
      // the same to R12 files it wrote itself (fixtures/bay2-r12.dxf). Such a SEQEND's handle is in no file.
      const handles = new Set(handlesOf(new Uint8Array(readFileSync(rep.file))).map((h) => h.toString(16).toUpperCase()));
      for (const fix of rep.fixes) {
        const m = /^Deleted SEQEND\(#([0-9A-F]+)\) entity with invalid owner handle #None\.$/.exec(fix);
        expect(m, fix).not.toBeNull();
        expect(handles.has(m![1]!)).toBe(false);
      }
      expect(rep.hcEntities).toBeGreaterThan(5);
      expect(rep.blocks).toContain('HC-LEGEND');
    }
  });
});

describeWith('python3-ezdxf', hasEzdxf(), 'annotation texts measured by ezdxf', () => {
  // The demo, the buildings, and a crowded plan: heads 3 ft apart (every one a finding), a drawn area beside the
  // searched ones, tags of close heads. Text boxes by ezdxf's text-size tool (its monospace font without Matplotlib:
  // each character as wide as the text is high), the legend by its frame.
  const crowded = layoutDxf({
    s: 3,
    l: 3,
    heads: 10,
    lines: 6,
    drawnArea: [
      { x: 0, y: 0 },
      { x: 15, y: 0 },
      { x: 15, y: 18 },
      { x: 0, y: 18 },
    ],
  });
  const more = [
    ...['two-risers', 'zones', 'l-room'].map((n) => ({
      name: `building-${n}`,
      bytes: new Uint8Array(readFileSync(`fixtures/building-${n}.dxf`)),
      config: {},
    })),
    { name: 'crowded', bytes: new TextEncoder().encode(crowded), config: { design: { area: 300 } } },
  ];
  it.each([...cases, ...more].map((c) => [c.name, c] as const))('%s: no two HC- texts overlap, none overlaps the legend', (_, c) => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-texts-'));
    const file = join(dir, `${c.name}.dxf`);
    writeFileSync(file, annotate(c).out);
    const r = spawnSync(SYSTEM_PYTHON, ['scripts/ezdxf-texts.py', file], { encoding: 'utf8', timeout: 120_000 });
    expect(r.status, r.stderr).toBe(0);
    const { texts, legends } = JSON.parse(r.stdout) as { texts: { text: string; box: number[] }[]; legends: number[][] };
    expect(texts.length).toBeGreaterThan(3);
    expect(legends).toHaveLength(1);
    const overlap = (a: number[], b: number[]) =>
      a[0]! < b[2]! - 1e-9 && b[0]! < a[2]! - 1e-9 && a[1]! < b[3]! - 1e-9 && b[1]! < a[3]! - 1e-9;
    const clashes: string[] = [];
    texts.forEach((t, i) => {
      for (const u of texts.slice(i + 1)) if (overlap(t.box, u.box)) clashes.push(`"${t.text}" over "${u.text}"`);
      if (overlap(t.box, legends[0]!)) clashes.push(`"${t.text}" over the legend`);
    });
    expect(clashes).toEqual([]);
  });

  it('every annotation colour reads on white and on black paper: contrast ratio at least 3.5 on both (WCAG 2 formula, ezdxf palette)', () => {
    const r = spawnSync(
      SYSTEM_PYTHON,
      [
        '-c',
        `import json; from ezdxf.colors import aci2rgb; print(json.dumps([aci2rgb(i) for i in ${JSON.stringify([...ANNOTATION_COLORS])}]))`,
      ],
      {
        encoding: 'utf8',
        timeout: 60_000,
      },
    );
    expect(r.status, r.stderr).toBe(0);
    const luminance = (rgb: number[]) => {
      const [R, G, B] = rgb.map((c) => (c / 255 <= 0.03928 ? c / 255 / 12.92 : ((c / 255 + 0.055) / 1.055) ** 2.4));
      return 0.2126 * R! + 0.7152 * G! + 0.0722 * B!;
    };
    for (const [i, rgb] of (JSON.parse(r.stdout) as number[][]).entries()) {
      const L = luminance(rgb);
      const color = ANNOTATION_COLORS[i];
      if (color === 7) continue; // black on white paper, white on black: by the background itself
      expect(Math.min(1.05 / (L + 0.05), (L + 0.05) / 0.05), `ACI ${color}`).toBeGreaterThanOrEqual(3.5);
    }
  });
});

describeWith('librecad and poppler-utils', canRender(), 'annotated drawing in LibreCAD', () => {
  it('renders with dxf2pdf, and the annotations add visible ink', () => {
    const dir = mkdtempSync(join(tmpdir(), 'hc-render-'));
    const c = cases.find((x) => x.name === 'demo')!;
    writeFileSync(join(dir, 'plain.dxf'), c.bytes);
    writeFileSync(join(dir, 'annotated.dxf'), annotate(c).out);
    for (const name of ['plain', 'annotated']) renderPdf(dir, name);
    expect(
      readdirSync(dir)
        .filter((f) => f.endsWith('.pdf'))
        .sort(),
    ).toEqual(['annotated.pdf', 'plain.pdf']);
    const plain = inkShare(join(dir, 'plain.pdf'));
    const annotated = inkShare(join(dir, 'annotated.pdf'));
    expect(plain).toBeGreaterThan(0.001);
    expect(annotated).toBeGreaterThan(plain * 1.05);
    mkdirSync('test-artifacts', { recursive: true });
    copyFileSync(join(dir, 'annotated.pdf'), join('test-artifacts', 'annotated-demo.pdf'));
  });
});
