// What the README and the package publish from the code, generated so that it cannot drift: headcheck.schema.json
// and the config reference (from src/config/schema.ts), and the table of rules (from the rules' registry).
// Run: npm run docs (tests check that all three are current).

import { readFileSync, writeFileSync } from 'node:fs';
import { toJsonSchema, type JsonSchema } from '@valibot/to-json-schema';
import { configSchema, QUANTITIES, type QuantityMeta } from '../src/config/schema.js';
import { RULES } from '../src/rules/registry.js';

export const SCHEMA_FILE = 'headcheck.schema.json';
/** A generated part of the README, between its two marker lines. */
export interface Section {
  start: string;
  end: string;
  text: () => string;
}

/** Numbers as a person writes them: six significant figures. */
const tidy = (x: number) => +x.toPrecision(6);

function tidyNumbers(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(tidyNumbers);
  if (node && typeof node === 'object') return Object.fromEntries(Object.entries(node).map(([k, v]) => [k, tidyNumbers(v)]));
  return typeof node === 'number' ? tidy(node) : node;
}

/** Pairs ([flow, pressure]) as draft-07 states a tuple exactly: its item count fixed, no further items. */
function closeTuples(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(closeTuples);
  if (!node || typeof node !== 'object') return node;
  const out = Object.fromEntries(Object.entries(node).map(([k, v]) => [k, closeTuples(v)])) as Record<string, unknown>;
  if (Array.isArray(out['items'])) {
    const n = (out['items'] as unknown[]).length;
    Object.assign(out, { minItems: n, maxItems: n, additionalItems: false });
  }
  return out;
}

/** The JSON Schema: the SI variant when `unitSystem` is "si", else the US one (each with its units' ranges). */
export function configJsonSchema(): Record<string, unknown> {
  const variant = (system: 'us' | 'si'): JsonSchema => {
    const schema = toJsonSchema(configSchema(system), { typeMode: 'input', errorMode: 'ignore', ignoreActions: ['metadata'] });
    delete (schema as { $schema?: string }).$schema;
    return closeTuples(tidyNumbers(schema)) as JsonSchema;
  };
  return {
    $schema: 'http://json-schema.org/draft-07/schema#',
    $id: 'https://headcheck.invalid/headcheck.schema.json',
    title: 'headcheck config',
    description: 'Config of headcheck, a screening aid for fire-sprinkler plan review. Values are in US units unless "unitSystem" is "si".',
    if: { type: 'object', properties: { unitSystem: { const: 'si' } }, required: ['unitSystem'] },
    // biome-ignore lint/suspicious/noThenProperty: JSON Schema's own keyword
    then: variant('si'),
    else: variant('us'),
  };
}

interface Row {
  key: string;
  type: string;
  fallback: string;
  example: string;
  unit: string;
  range: string;
  meaning: string;
}

type Node = {
  type?: string;
  wrapped?: Node;
  default?: unknown;
  pipe?: Node[];
  entries?: Record<string, Node>;
  /** A record's value schema. */
  value?: Node;
  /** An array's item schema. */
  item?: Node;
  /** A literal's value (a variant's tag). */
  literal?: unknown;
  options?: unknown[];
  description?: string;
  metadata?: { quantity?: QuantityMeta };
  examples?: unknown[];
};

/** One row a key, in schema order, walking into sections. */
function rows(node: Node, prefix: string, out: Row[]): Row[] {
  for (const [key, entry] of Object.entries(node.entries ?? {})) {
    const path = prefix ? `${prefix}.${key}` : key;
    const optional = entry.type === 'optional' ? entry : null;
    const inner = optional ? optional.wrapped! : entry;
    const base = inner.pipe ? inner.pipe[0]! : inner;
    const actions = inner.pipe ?? [];
    const meaning = actions.find((a) => a.type === 'description')?.description ?? '';
    const meta = actions.find((a) => a.type === 'metadata')?.metadata?.quantity;
    const fallback = optional && optional.default !== undefined ? optional.default : undefined;
    const shownDefault =
      fallback === undefined || (typeof fallback === 'object' && !Array.isArray(fallback)) ? '' : JSON.stringify(tidyNumbers(fallback));
    const example = actions.find((a) => a.type === 'examples')?.examples?.[0];
    if (base.type === 'strict_object') {
      out.push({ key: path, type: 'object', fallback: '', example: '', unit: '', range: '', meaning });
      rows(base, path, out);
      continue;
    }
    if (base.type === 'record') {
      // A map of names the user chooses: its values' keys under `<name>`.
      out.push({
        key: path,
        type: 'object of name patterns',
        fallback: '',
        example: example === undefined ? '' : JSON.stringify(example),
        unit: '',
        range: '',
        meaning,
      });
      const value = base.value!.pipe ? base.value!.pipe[0]! : base.value!;
      rows(value, `${path}.<pattern>`, out);
      continue;
    }
    const item = base.type === 'array' && base.item ? (base.item.pipe ? base.item.pipe[0]! : base.item) : null;
    if (item?.type === 'variant') {
      // A list of tagged objects: each kind's keys under `[type=KIND]`.
      out.push({ key: path, type: 'list of objects', fallback: '', example: '', unit: '', range: '', meaning });
      for (const option of item.options as Node[]) {
        const tag = option.entries!['type']!.literal;
        rows(
          { entries: Object.fromEntries(Object.entries(option.entries!).filter(([k]) => k !== 'type')) },
          `${path}[type=${String(tag)}]`,
          out,
        );
      }
      continue;
    }
    const unit = meta && meta.kind !== 'number' ? `${QUANTITIES[meta.kind].us} / ${QUANTITIES[meta.kind].si}` : '';
    const range = meta ? `${meta.above !== undefined ? `> ${tidy(meta.above)}` : `≥ ${tidy(meta.min!)}`}, ≤ ${tidy(meta.max)}` : '';
    // A quantity's description ends with its unit, which has a column of its own here.
    const said = unit ? meaning.replace(/ \([^)]*\)$/, '') : meaning;
    out.push({
      key: path,
      type: typeOf(base),
      fallback: shownDefault,
      example: example === undefined ? shownDefault : JSON.stringify(example),
      unit,
      range,
      meaning: said,
    });
  }
  return out;
}

function typeOf(base: Node): string {
  if (base.type === 'picklist') return (base.options as unknown[]).map((o) => JSON.stringify(o)).join(' | ');
  if (base.type === 'union') return [...new Set((base.options as Node[]).map(typeOf))].join(' or ');
  if (base.type === 'array') return base.item?.type === 'tuple' ? 'list of [flow, pressure]' : 'list of text';
  return base.type === 'string' ? 'text' : (base.type ?? '');
}

/** The README's config reference: every key with its type, default (US), units (US / SI), range (US) and meaning. */
export function configReference(): string {
  const table = rows(configSchema('us') as unknown as Node, '', []);
  const esc = (s: string) => s.replace(/\|/g, '\\|');
  const code = (s: string) => (s ? `\`${esc(s)}\`` : '');
  return [
    '',
    'Every key is optional. Numbers are in the units of `unitSystem` (US / SI below); ranges are shown in US units and',
    "checked in the config's own. A key the tool does not know, a value of the wrong type or out of range stops the",
    "tool (exit 2) with the key's dotted path. The published JSON Schema is `headcheck.schema.json`.",
    '',
    '| key | type | default | example | unit (US / SI) | range (US) | meaning |',
    '|---|---|---|---|---|---|---|',
    ...table.map(
      (r) => `| \`${r.key}\` | ${esc(r.type)} | ${code(r.fallback)} | ${code(r.example)} | ${r.unit} | ${r.range} | ${esc(r.meaning)} |`,
    ),
    '',
  ].join('\n');
}

/** The README's table of rules: id, severity, what it checks and its source, in the order the report lists them. */
export function rulesReference(): string {
  const esc = (s: string) => s.replace(/\|/g, '\\|');
  return [
    '',
    '| rule | severity | checks | limit and source |',
    '|---|---|---|---|',
    ...RULES.map((r) => `| \`${r.meta.id}\` | ${r.meta.severity} | ${esc(r.meta.title)} | ${esc(r.meta.reference)} |`),
    '',
  ].join('\n');
}

export const SECTIONS: Section[] = [
  {
    start: '<!-- config reference: generated by `npm run docs` from src/config/schema.ts -->',
    end: '<!-- end of config reference -->',
    text: configReference,
  },
  { start: '<!-- rules: generated by `npm run docs` from src/rules/registry.ts -->', end: '<!-- end of rules -->', text: rulesReference },
];

/** The README with every generated section made anew. */
export function withSections(readme: string): string {
  let out = readme;
  for (const s of SECTIONS) {
    const start = out.indexOf(s.start);
    const end = out.indexOf(s.end);
    if (start < 0 || end < start) throw new Error(`README.md has no section marked ${s.start}`);
    out = out.slice(0, start + s.start.length) + s.text() + out.slice(end);
  }
  return out;
}

if (process.argv[1]?.endsWith('docs.js')) {
  writeFileSync(SCHEMA_FILE, `${JSON.stringify(configJsonSchema(), null, 2)}\n`);
  writeFileSync('README.md', withSections(readFileSync('README.md', 'utf8')));
  console.log(`wrote ${SCHEMA_FILE} and the README's generated sections`);
}
