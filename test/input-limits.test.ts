// The input limits (config "inputLimits"; common practice, no source): each stops a drawing past it with a
// one-line error naming the key that raises it, and each can be raised so that the same drawing is checked.

import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { main } from '../src/cli/main.js';
import { DEFAULT_INPUT_LIMITS, parseSettings, type InputLimits } from '../src/config/settings.js';
import { layoutDxf } from '../src/demo/generated-layout.js';
import { DxfWriter } from '../src/demo/dxf-writer.js';
import { InputError } from '../src/input-error.js';
import { readDrawing } from '../src/read/read-drawing.js';
import { checkLayout } from './support/check.js';

const bytes = (s: string) => new TextEncoder().encode(s);
const limits = (over: Partial<InputLimits>): InputLimits => ({ ...DEFAULT_INPUT_LIMITS, ...over });
/** A layout of 3 lines of 4 heads: 12 heads, 12 head references, 3 + 2 + 1 pipe lines and a room. */
const layout = layoutDxf({ s: 12, l: 10, heads: 4, lines: 3 });

describe('input limits', () => {
  it('entities: the file may hold at most inputLimits.entities entities, blocks included', () => {
    expect(() => readDrawing(bytes(layout), { limits: limits({ entities: 10 }) })).toThrow(
      /more than 10 entities \(inputLimits\.entities\)/,
    );
    expect(readDrawing(bytes(layout), { limits: limits({ entities: 1000 }) }).refs.length).toBeGreaterThan(10);
  });

  it('textLength: a value longer than inputLimits.textLength is refused, naming its line', () => {
    const w = new DxfWriter(2);
    w.text('NOTES', { x: 0, y: 0 }, 1, 'x'.repeat(300));
    const text = w.toString();
    const line = text.split('\n').findIndex((l) => l.startsWith('xxx')) + 1;
    expect(() => readDrawing(bytes(text), { limits: limits({ textLength: 100 }) })).toThrow(
      new RegExp(`line ${line}: a value of 300 bytes.*inputLimits\\.textLength`),
    );
    expect(() => readDrawing(bytes(text), { limits: limits({ textLength: 1000 }) })).not.toThrow();
  });

  it('fileMB: a larger drawing is refused before it is parsed', () => {
    expect(() => readDrawing(bytes(layout), { limits: limits({ fileMB: 1 / 1024 }) })).toThrow(
      /larger than .* MiB \(inputLimits\.fileMB\)/,
    );
  });

  it('networkNodes: the rebuilt piping may have at most inputLimits.networkNodes nodes', () => {
    expect(() => checkLayout({ s: 12, l: 10, heads: 4, lines: 3 }, { inputLimits: { networkNodes: 5 } })).toThrow(InputError);
    expect(() => checkLayout({ s: 12, l: 10, heads: 4, lines: 3 }, { inputLimits: { networkNodes: 5 } })).toThrow(
      /over the limit of 5 \(inputLimits\.networkNodes\)/,
    );
    expect(checkLayout({ s: 12, l: 10, heads: 4, lines: 3 }, { inputLimits: { networkNodes: 100 } }).plan.heads).toHaveLength(12);
  });

  it('config: every key is a positive number, unknown keys are refused', () => {
    expect(parseSettings({ inputLimits: { entities: 42 } }).inputLimits).toEqual(limits({ entities: 42 }));
    expect(() => parseSettings({ inputLimits: { entities: 0 } })).toThrow(/inputLimits\.entities" must be greater than 0/);
    expect(() => parseSettings({ inputLimits: { pages: 3 } })).toThrow(/unknown key "inputLimits\.pages"/);
  });
});

describe('input limits at the command line', () => {
  let dir: string;
  beforeAll(() => {
    dir = mkdtempSync(join(tmpdir(), 'hc-limits-'));
  });

  it('a file over inputLimits.fileMB is refused with exit 2 before it is read; raising the limit checks it', async () => {
    const drawing = join(dir, 'plan.dxf');
    writeFileSync(drawing, layout);
    writeFileSync(join(dir, 'small.json'), JSON.stringify({ inputLimits: { fileMB: 0.001 } }));
    writeFileSync(join(dir, 'large.json'), JSON.stringify({ inputLimits: { fileMB: 1 } }));
    const err: string[] = [];
    const io = { out: () => undefined, err: (s: string) => err.push(s) };
    expect(await main(['node', 'headcheck', 'check', drawing, '--config', join(dir, 'small.json')], io)).toBe(2);
    expect(err.join('\n')).toMatch(
      new RegExp(`^headcheck: ${drawing.replace(/[/\\.]/g, '\\$&')}: larger than 0.001 MiB \\(inputLimits\\.fileMB\\)$`),
    );
    expect(await main(['node', 'headcheck', 'check', drawing, '--config', join(dir, 'large.json')], io)).not.toBe(2);
  });
});
