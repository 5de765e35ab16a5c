// Every rule is wired in one place, in the manner of ESLint's own rule checks: each rule module is registered, has
// a test table of valid and invalid cases beside it, names the source of its limit, has its message in the one
// table, and a row in the README's rule table (generated; test/config-schema.test.ts checks it is current).

import { existsSync, readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { MESSAGES } from '../src/rules/messages.js';
import { RULES } from '../src/rules/registry.js';

/** Modules of src/rules/ that are not rules: the types, the registry, the message table, a shared predicate. */
const NOT_RULES = new Set(['types.ts', 'registry.ts', 'messages.ts', 'standard-heads.ts']);
const modules = readdirSync('src/rules').filter((f) => f.endsWith('.ts') && !f.endsWith('.test.ts') && !NOT_RULES.has(f));
const ids = RULES.map((r) => r.meta.id);

describe('the rules, wired in one place', () => {
  it('every rule module is registered, once, under its own file name', () => {
    expect(modules.map((f) => f.replace(/\.ts$/, '')).sort()).toEqual([...ids].sort());
    expect(new Set(ids).size).toBe(ids.length);
  });

  it.each(ids)('%s has a table of valid and invalid cases beside it', (id) => {
    const file = `src/rules/${id}.test.ts`;
    expect(existsSync(file), file).toBe(true);
    const text = readFileSync(file, 'utf8');
    expect(text).toMatch(/ruleTester\(/);
    const block = (key: string) => text.slice(text.indexOf(`${key}: [`), text.indexOf(']', text.indexOf(`${key}: [`)) + 1);
    expect(block('valid')).toMatch(/name:/);
    expect(text.slice(text.indexOf('invalid: ['))).toMatch(/name:/);
  });

  it.each(RULES.map((r) => [r.meta.id, r.meta.reference] as const))('%s names the source of its limit', (_, reference) => {
    expect(reference).toMatch(/NFPA \d+ \(\d{4} edition\)|common practice|from memory|DXF reference/);
    expect(reference).not.toMatch(/see limits/i);
  });

  it('every kind of finding has its words in the message table', () => {
    for (const id of ids) expect(typeof MESSAGES[id], id).toBe('function');
  });

  it.each(ids)('%s has a row in the README', (id) => {
    expect(readFileSync('README.md', 'utf8')).toContain(`| \`${id}\` |`);
  });
});
