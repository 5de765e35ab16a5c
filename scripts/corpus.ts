// Runs `headcheck layers` and `headcheck check` over a folder of drawings, each in a process of its own under a
// time limit, and tables the outcome: exit code, the message, wall time and peak memory. Usage (after a build):
//   npm run corpus -- FOLDER [--out results.md] [--json results.json] [--workers 2] [--configs FOLDER]
// A config FOLDER/NAME.json is given to both commands for drawing NAME when it exists.

import { spawn } from 'node:child_process';
import { existsSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';

export interface CorpusRun {
  /** Exit code, or null when the run was stopped at its time limit. */
  code: number | null;
  /** The last line on stderr, else on stdout. */
  message: string;
  stderrLines: number;
  seconds: number;
  /** Peak resident memory of the process, MiB. */
  peakMiB: number;
}

export interface CorpusRow {
  file: string;
  bytes: number;
  layers: CorpusRun;
  check: CorpusRun;
}

const DIST_MAIN = resolve('dist/cli/main.js');

/**
 * One command in a child process: the built CLI's `main` run in-process by a one-line program that reports the
 * exit code and its own peak memory on descriptor 3 when it ends; killed at `timeoutS`.
 */
export function runOnce(args: string[], timeoutS: number): Promise<CorpusRun> {
  const program =
    `import(${JSON.stringify(new URL(`file://${DIST_MAIN}`).href)}).then((m) => m.main(['node', 'headcheck', ...JSON.parse(process.argv[1])]))` +
    `.then((code) => { require('fs').writeSync(3, JSON.stringify({ code, rss: process.resourceUsage().maxRSS })); process.exitCode = code; })`;
  return new Promise((done) => {
    const started = performance.now();
    const child = spawn(process.execPath, ['-e', program, JSON.stringify(args)], { stdio: ['ignore', 'pipe', 'pipe', 'pipe'] });
    const streams = [child.stdout!, child.stderr!, child.stdio[3] as NodeJS.ReadableStream];
    const text = ['', '', ''];
    streams.forEach((s, i) => {
      s.on('data', (d: Buffer) => {
        text[i] += d.toString('utf8');
      });
    });
    const timer = setTimeout(() => child.kill('SIGKILL'), timeoutS * 1000);
    child.on('close', (exit) => {
      clearTimeout(timer);
      const seconds = (performance.now() - started) / 1000;
      let report: { code: number; rss: number } | null = null;
      try {
        report = JSON.parse(text[2]!);
      } catch {
        report = null;
      }
      const lines = (s: string) =>
        s
          .split('\n')
          .map((l) => l.trim())
          .filter(Boolean);
      const err = lines(text[1]!);
      const out = lines(text[0]!);
      done({
        code: report ? report.code : exit === null ? null : exit,
        message: err.at(-1) ?? out.at(-1) ?? '',
        stderrLines: err.length,
        seconds,
        peakMiB: report ? report.rss / 1024 : Number.NaN,
      });
    });
  });
}

/** Every drawing of `folder` through both commands, `workers` at a time, in file-name order. */
export async function runCorpus(
  folder: string,
  options: { workers?: number; timeoutS?: number; configs?: string; onlyWithConfig?: boolean; extensions?: string[] } = {},
): Promise<CorpusRow[]> {
  const configOf = (f: string) =>
    options.configs && existsSync(join(options.configs, `${f}.json`)) ? join(options.configs, `${f}.json`) : null;
  const files = readdirSync(folder)
    .filter((f) => statSync(join(folder, f)).isFile() && (!options.onlyWithConfig || configOf(f)))
    .filter((f) => !options.extensions || options.extensions.some((ext) => f.toLowerCase().endsWith(ext)))
    .sort();
  const rows: CorpusRow[] = new Array(files.length);
  let next = 0;
  const worker = async () => {
    for (let i = next++; i < files.length; i = next++) {
      const file = join(folder, files[i]!);
      const given = configOf(files[i]!);
      const config = given ? ['--config', given] : ['--no-config'];
      const limit = options.timeoutS ?? 120;
      const layers = await runOnce(['layers', file, ...config], limit);
      const check = await runOnce(['check', file, '--quiet', ...config], limit);
      rows[i] = { file: files[i]!, bytes: statSync(file).size, layers, check };
    }
  };
  await Promise.all(Array.from({ length: options.workers ?? 2 }, worker));
  return rows;
}

/** The rows as a Markdown table (the folder's path shortened to FILE in messages). */
export function corpusTable(rows: CorpusRow[], folder: string): string {
  const cell = (s: string) => s.split(resolve(folder)).join('').split(folder).join('').replace(/\|/g, '\\|').slice(0, 160);
  return [
    '| file | KB | layers exit | check exit | check message (last line) | check s | check MiB |',
    '|---|---|---|---|---|---|---|',
    ...rows.map(
      (r) =>
        `| ${r.file} | ${Math.round(r.bytes / 1024)} | ${r.layers.code} | ${r.check.code} | ${cell(r.check.message)} | ${r.check.seconds.toFixed(2)} | ${r.check.peakMiB.toFixed(0)} |`,
    ),
  ].join('\n');
}

if (process.argv[1]?.endsWith('corpus.js')) {
  const args = process.argv.slice(2);
  const flag = (name: string) => {
    const i = args.indexOf(name);
    return i >= 0 ? args.splice(i, 2)[1] : undefined;
  };
  const out = flag('--out');
  const json = flag('--json');
  const workers = Number(flag('--workers') ?? 2);
  const configs = flag('--configs');
  const folder = args[0];
  if (!folder) {
    console.error('usage: npm run corpus -- FOLDER [--out results.md] [--json results.json] [--workers 2] [--configs FOLDER]');
    process.exit(2);
  }
  const rows = await runCorpus(folder, { workers, ...(configs ? { configs } : {}) });
  const table = corpusTable(rows, folder);
  if (out) writeFileSync(out, `${table}\n`);
  if (json) writeFileSync(json, `${JSON.stringify(rows, null, 2)}\n`);
  console.log(table);
}
