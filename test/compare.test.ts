// Comparing revisions: ezdxf (Debian python3-ezdxf) edits the demo drawing as CAD does, keeping every other handle
// (moves a head, deletes one, adds one unpiped and too close to another, labels a pipe; then pipes the added head),
// and each change lands in its list; a drawing against itself has nothing resolved or added; heads redrawn with new
// handles match by place.

import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { ComparisonReport } from '../src/compare/outputs.js';
import { DEMO_CONFIG, demoDrawing } from '../src/demo/scenario.js';
import { describeWith, hasEzdxf, SYSTEM_PYTHON } from './support/external.js';

/** ezdxf edits, as a reviewer's designer would make them in CAD (the drawing is in inches). */
const EDIT = `
import sys, ezdxf
doc = ezdxf.readfile(sys.argv[1])
msp = doc.modelspace()
db = doc.entitydb
mode = sys.argv[3]
if mode == "revise":
    moved = db["191"]
    moved.dxf.insert = moved.dxf.insert + (12, 0, 0)      # one head 1 ft to the right
    msp.delete_entity(db["1D2"])                           # the head 4 ft from 1CF goes
    near = db["1CF"].dxf.insert + (0, -30, 0)              # a new head 2.5 ft from 1CF
    added = msp.add_blockref("SPK-PENDENT", near, dxfattribs={"layer": "FP-SPRK-HEAD"})
    msp.add_text('1-1/4"', dxfattribs={"layer": "FP-PIPE-SIZE", "height": 4, "insert": (22, 664)})  # pipe 129 labelled
    print(added.dxf.handle)
elif mode == "pipe":  # the head added unattached gets its arm: a pipe to the branch line it stands beside
    at = db[sys.argv[4]].dxf.insert
    msp.add_line(at, (at.x, 648), dxfattribs={"layer": "FP-PIPE"})
else:  # "redraw": every head deleted and drawn again at its place (new handles)
    for e in list(msp.query('INSERT[layer=="FP-SPRK-HEAD"]')):
        name, at, attribs = e.dxf.name, e.dxf.insert, [(a.dxf.tag, a.dxf.text) for a in e.attribs]
        msp.delete_entity(e)
        ref = msp.add_blockref(name, at, dxfattribs={"layer": "FP-SPRK-HEAD"})
        for tag, text in attribs:
            ref.add_attrib(tag, text, insert=at)
doc.saveas(sys.argv[2])
`;

function compare(
  dir: string,
  before: string,
  after: string,
): { status: number | null; report: ComparisonReport; md: string; html: string } {
  const args = ['bin/headcheck.js', 'compare', before, after, '--config', join(dir, 'plan.config.json')];
  const out = ['json', 'md', 'html'].flatMap((f) => [`--${f}`, join(dir, `cmp.${f}`)]);
  const r = spawnSync(process.execPath, [...args, ...out], { encoding: 'utf8', timeout: 120_000 });
  expect(r.stderr).not.toMatch(/internal error/);
  return {
    status: r.status,
    report: JSON.parse(readFileSync(join(dir, 'cmp.json'), 'utf8')),
    md: readFileSync(join(dir, 'cmp.md'), 'utf8'),
    html: readFileSync(join(dir, 'cmp.html'), 'utf8'),
  };
}

function revision(mode: 'revise' | 'redraw') {
  const dir = mkdtempSync(join(tmpdir(), 'hc-compare-'));
  writeFileSync(join(dir, 'plan.dxf'), demoDrawing());
  // ezdxf writes the demo's R12 header without $INSUNITS (not an R12 variable): the config states the unit.
  writeFileSync(join(dir, 'plan.config.json'), JSON.stringify({ ...DEMO_CONFIG, units: 'in' }));
  const r = spawnSync(SYSTEM_PYTHON, ['-c', EDIT, join(dir, 'plan.dxf'), join(dir, 'plan-b.dxf'), mode], {
    encoding: 'utf8',
    timeout: 60_000,
  });
  expect(r.status, r.stderr).toBe(0);
  return { dir, addedHandle: r.stdout.trim() };
}

describeWith('python3-ezdxf', hasEzdxf(), 'compare', () => {
  it('a drawing against itself: nothing resolved, added, moved; every finding unchanged', () => {
    const { dir } = revision('revise');
    const c = compare(dir, join(dir, 'plan.dxf'), join(dir, 'plan.dxf'));
    expect(c.status).toBe(1); // the demo has errors (README)
    expect(c.report.findings.resolved).toEqual([]);
    expect(c.report.findings.added).toEqual([]);
    expect(c.report.findings.unchanged.length).toBe(c.report.after.summary.errors + c.report.after.summary.warnings + countInfo(c.report));
    expect(c.report.heads).toEqual({ added: [], removed: [], moved: [], matchedByPosition: 0 });
    expect(c.report.pipes.resized).toEqual([]);
    expect(c.report.designAreas.after).toEqual(c.report.designAreas.before);
    expect(readdirSync(dir).sort()).toEqual(['cmp.html', 'cmp.json', 'cmp.md', 'plan-b.dxf', 'plan.config.json', 'plan.dxf']);
  });

  it('an edited revision: each change in its list, the comment answered resolved, the new violation added', () => {
    const { dir, addedHandle } = revision('revise');
    const c = compare(dir, join(dir, 'plan.dxf'), join(dir, 'plan-b.dxf'));
    const r = c.report;
    expect(r.heads.moved.map((m) => [m.handle, m.distance])).toEqual([['191', 1]]); // 12 in = 1 ft
    expect(r.heads.removed.map((h) => h.handle)).toEqual(['1D2']);
    expect(r.heads.added.map((h) => h.handle)).toEqual([addedHandle]);
    expect(r.pipes.resized).toEqual([{ handles: ['129'], before: '1', after: '1-1/4' }]);
    const rules = (list: { rule: string; handles: string[] }[]) => list.map((f) => `${f.rule} ${[...f.handles].sort().join(',')}`);
    // Answered: the two heads 4 ft apart, the unlabelled pipe.
    expect(rules(r.findings.resolved)).toContain('head-distance-min 1CF,1D2');
    expect(rules(r.findings.resolved)).toContain('pipe-size-defaulted 129');
    // New: the head 2.5 ft from 1CF.
    expect(rules(r.findings.added)).toContain(`head-distance-min ${['1CF', addedHandle].sort().join(',')}`);
    // Untouched comments stay unchanged: the drawn area's length.
    expect(r.findings.unchanged.map((p) => p.after.rule)).toContain('design-area-length');
    expect(r.summary.pass).toBe(false);
    expect(c.status).toBe(1);
    expect(c.md).toMatch(/## Comments addressed \(\d+\)[\s\S]*head-distance-min[\s\S]*## New comments/);
    expect(c.md).toContain('head moved: 191 by 1 ft');
    expect(c.md).toContain(r.caution);
    // The HTML strikes the resolved through on the later plan and rings the new ones.
    expect((c.html.match(/<g class="resolved">/g) ?? []).length).toBe(r.findings.resolved.length);
    expect((c.html.match(/<circle class="added"/g) ?? []).length).toBe(r.findings.added.length);
    expect(c.html).toContain('authority having jurisdiction');
  });

  it('the next revision pipes the head it left unattached: that comment is resolved', () => {
    const { dir, addedHandle } = revision('revise');
    const r = spawnSync(SYSTEM_PYTHON, ['-c', EDIT, join(dir, 'plan-b.dxf'), join(dir, 'plan-c.dxf'), 'pipe', addedHandle], {
      encoding: 'utf8',
      timeout: 60_000,
    });
    expect(r.status, r.stderr).toBe(0);
    const c = compare(dir, join(dir, 'plan-b.dxf'), join(dir, 'plan-c.dxf'));
    expect(c.report.findings.resolved.map((f) => `${f.rule} ${f.handles.join(',')}`)).toContain(`head-unattached ${addedHandle}`);
    expect(c.report.heads).toEqual({ added: [], removed: [], moved: [], matchedByPosition: 0 });
  });

  it('heads redrawn with new handles are matched by place: nothing added or removed, findings unchanged', () => {
    const { dir } = revision('redraw');
    const c = compare(dir, join(dir, 'plan.dxf'), join(dir, 'plan-b.dxf'));
    expect(c.report.heads.added).toEqual([]);
    expect(c.report.heads.removed).toEqual([]);
    expect(c.report.heads.matchedByPosition).toBe(65);
    expect(c.report.findings.resolved).toEqual([]);
    expect(c.report.findings.added).toEqual([]);
  });
});

describeWith('python3-ezdxf', hasEzdxf(), 'batch --compare-with', () => {
  it('pairs drawings by relative path and adds the counts to each row, worst first; a drawing without one has none', () => {
    const { dir } = revision('revise');
    const [earlier, later] = [join(dir, 'v1'), join(dir, 'v2')];
    for (const d of [earlier, later]) {
      mkdirSync(join(d, 'level-1'), { recursive: true });
      copyFileSync(join(dir, 'plan.config.json'), join(d, 'headcheck.json'));
    }
    copyFileSync(join(dir, 'plan.dxf'), join(earlier, 'level-1', 'plan.dxf'));
    copyFileSync(join(dir, 'plan-b.dxf'), join(later, 'level-1', 'plan.dxf'));
    copyFileSync(join(dir, 'plan.dxf'), join(later, 'new.dxf'));
    const args = ['bin/headcheck.js', 'batch', later, '--out', join(dir, 'out'), '--compare-with', earlier, '--no-dxf', '--no-html'];
    const r = spawnSync(process.execPath, args, { encoding: 'utf8', timeout: 180_000 });
    expect(r.status, r.stderr).toBe(1);
    const rows = JSON.parse(readFileSync(join(dir, 'out', 'summary.json'), 'utf8')).drawings as {
      file: string;
      resolved: number | null;
      added: number | null;
    }[];
    const one = compare(dir, join(dir, 'plan.dxf'), join(dir, 'plan-b.dxf')).report.summary;
    const byName = (end: string) => rows.find((x) => x.file.endsWith(end))!;
    expect([byName('level-1/plan.dxf').resolved, byName('level-1/plan.dxf').added]).toEqual([one.resolved, one.added]);
    expect([byName('new.dxf').resolved, byName('new.dxf').added]).toEqual([null, null]);
    const html = readFileSync(join(dir, 'out', 'index.html'), 'utf8');
    expect(html.indexOf('level-1/plan.dxf')).toBeLessThan(html.indexOf('new.dxf')); // more errors and new findings first
    const refused = spawnSync(process.execPath, [...args.slice(0, 5), '--compare-with', join(dir, 'nowhere')], { encoding: 'utf8' });
    expect(refused.status).toBe(2);
    expect(refused.stderr.trim().split('\n')).toHaveLength(1);
  }, 240_000);
});

describe('compare refuses in one line', () => {
  it.each([
    ['a missing earlier drawing', (dir: string) => [join(dir, 'gone.dxf'), join(dir, 'plan.dxf'), '--no-config'], /gone\.dxf/],
    [
      'an output over the earlier drawing',
      (dir: string) => [join(dir, 'plan.dxf'), join(dir, 'plan.dxf'), '--no-config', '--json', join(dir, 'plan.dxf')],
      /plan\.dxf/,
    ],
    [
      'a config with a typo',
      (dir: string) => [join(dir, 'plan.dxf'), join(dir, 'plan.dxf'), '--config', join(dir, 'typo.json')],
      /did you mean "design\.hazard"/,
    ],
  ] as [string, (dir: string) => string[], RegExp][])(
    '%s: exit 2, one line, nothing written',
    (_what, args, message) => {
      const dir = mkdtempSync(join(tmpdir(), 'hc-compare-bad-'));
      writeFileSync(join(dir, 'plan.dxf'), demoDrawing());
      writeFileSync(join(dir, 'typo.json'), JSON.stringify({ design: { hazzard: 'OH2' } }));
      const before = readFileSync(join(dir, 'plan.dxf'));
      const r = spawnSync(process.execPath, ['bin/headcheck.js', 'compare', ...args(dir)], { encoding: 'utf8', timeout: 120_000 });
      expect(r.status).toBe(2);
      const lines = r.stderr.trim().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatch(message);
      expect(readdirSync(dir).sort()).toEqual(['plan.dxf', 'typo.json']);
      expect(readFileSync(join(dir, 'plan.dxf')).equals(before)).toBe(true);
    },
    120_000,
  );
});

const countInfo = (r: ComparisonReport) => r.findings.unchanged.filter((p) => p.after.severity === 'info').length;
