// The `headcheck` command line: parses options, reads files, runs the pure pipeline, writes outputs.
// Exit codes per the contract: 0 checked and no error, 1 error findings, 2 unusable input or option.

import { existsSync, mkdirSync, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Command, CommanderError, Option } from 'commander';
import { FORMAT_NAMES, FORMATS, type FormatName } from '../check/formats.js';
import type { CheckResult } from '../check/run-check.js';
import { COMPARE_FORMAT_NAMES, COMPARE_FORMATS, type CompareFormatName, revisionsOf } from '../compare/outputs.js';
import { LENGTH_UNITS, parseSettings, type LengthUnit, type Settings } from '../config/settings.js';
import type { UnitSystem } from '../quantities/convert.js';
import { InputError } from '../input-error.js';
import { TOOL } from '../version.js';
import { checkDrawingFile, drawingBytes, withFile } from '../io/drawing-file.js';
import { findConfig, loadSettings, type FoundConfig } from '../io/config-file.js';
import { assertNotInput, cleanUpOnSignals, writeAllAtomically } from '../io/files.js';
import { layersReport, layersText, starterConfig } from './layers-table.js';
import { findingLines, summaryLine } from './summary-line.js';

interface BatchCliOptions extends Partial<Record<FormatName, boolean>> {
  out: string;
  config?: string;
  drawingUnits?: LengthUnit;
  requireHydraulics?: boolean;
  units: UnitSystem;
  workers: string;
  timeLimit: string;
  memoryLimit: string;
  force?: boolean;
  compareWith?: string;
}

interface DrawingOptions {
  /** A config file; false with --no-config; absent: looked up beside the drawing. */
  config?: string | false;
  /** The drawing's length unit, over the config's and the header's. */
  drawingUnits?: LengthUnit;
  /** A drawing no hydraulic calculation can be made for is unusable (exit 2), not a warning. */
  requireHydraulics?: boolean;
}

type CheckOptions = DrawingOptions & Partial<Record<FormatName, string>> & { units: UnitSystem; quiet?: boolean };
type CompareOptions = DrawingOptions & Partial<Record<CompareFormatName, string>> & { units: UnitSystem; quiet?: boolean };

/** A config the command found by itself (not given): said on stderr when the command ends. */
const lookup: { found: FoundConfig | null } = { found: null };
const foundConfig = (): FoundConfig | null => lookup.found;
const configSaid = (c: FoundConfig) => `config ${c.path} (found ${c.how})`;

/**
 * The settings a command reads `drawing` with: the config given, none with --no-config, else the one `batch` would
 * use (found beside the drawing or in a parent folder).
 */
function settingsFor(drawing: string, opts: DrawingOptions): Settings {
  const found = opts.config === false ? null : opts.config ? null : findConfig(drawing);
  lookup.found = found;
  const settings = loadSettings(opts.config || found?.path);
  if (opts.drawingUnits) settings.units = opts.drawingUnits;
  return settings;
}

/** Checks one drawing and writes the requested outputs; returns the exit code. */
async function checkCommand(file: string, opts: CheckOptions, io: { out: (s: string) => void; err: (s: string) => void }): Promise<number> {
  const wanted = FORMAT_NAMES.filter((f) => opts[f]);
  for (const f of wanted) assertNotInput(opts[f]!, file);
  const result = await checkDrawing(file, opts);
  // Each output is made when its turn to be written comes, and is garbage once written.
  await writeAllAtomically(wanted.map((f) => ({ path: opts[f]!, data: () => withFile(file, () => FORMATS[f].make(result)) })));
  if (!opts.quiet) for (const line of findingLines(file, result.report)) io.out(line);
  io.out(summaryLine(file, result.report));
  return result.report.summary.pass ? 0 : 1;
}

/** One drawing checked with the settings `check` would use for it (its config found or given). */
function checkDrawing(file: string, opts: DrawingOptions & { units: UnitSystem }): Promise<CheckResult> {
  const options = { reportUnits: opts.units, requireHydraulics: opts.requireHydraulics === true, dwgThread: 'own-worker' as const };
  return checkDrawingFile(file, settingsFor(file, opts), options);
}

/** Checks two revisions of a drawing, writes the comparison's outputs; exit 1 when the later one has an error. */
async function compareCommand(
  earlier: string,
  later: string,
  opts: CompareOptions,
  io: { out: (s: string) => void; err: (s: string) => void },
): Promise<number> {
  const wanted = COMPARE_FORMAT_NAMES.filter((f) => opts[f]);
  for (const f of wanted) for (const input of [earlier, later]) assertNotInput(opts[f]!, input);
  const before = await checkDrawing(earlier, opts);
  const after = await checkDrawing(later, opts);
  const revisions = revisionsOf(before, after);
  await writeAllAtomically(wanted.map((f) => ({ path: opts[f]!, data: () => COMPARE_FORMATS[f].make(revisions) })));
  const { findings, heads } = revisions.comparison;
  if (!opts.quiet) {
    const added = findings.added.map(({ index }) => after.report.findings[index]!);
    for (const line of findingLines(later, { ...after.report, findings: added })) io.out(`new: ${line}`);
  }
  io.out(
    `${earlier} → ${later}: ${findings.resolved.length} resolved, ${findings.added.length} new, ${findings.unchanged.length} unchanged; ` +
      `heads ${heads.added.length} added, ${heads.removed.length} removed, ${heads.moved.length} moved; ${summaryLine(later, after.report)}`,
  );
  return after.report.summary.pass ? 0 : 1;
}

/** The folder of earlier revisions, or a one-line refusal. */
function compareFolder(dir: string): string {
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new InputError(`--compare-with ${dir}: no such folder`);
  return dir;
}

export async function main(
  argv: string[],
  io: { out: (s: string) => void; err: (s: string) => void } = {
    out: (s) => void process.stdout.write(`${s}\n`),
    err: (s) => void process.stderr.write(`${s}\n`),
  },
): Promise<number> {
  let code = 0;
  const program = new Command()
    .name('headcheck')
    .description('Screens fire-sprinkler layout drawings (DXF): spacing, coverage, design area and hydraulics.')
    .version(TOOL.version)
    .exitOverride()
    .configureOutput({ writeOut: (s) => io.out(s.trimEnd()), writeErr: (s) => io.err(s.trimEnd()) });
  const unitsOption = () => new Option('--units <system>', 'units of the report').choices(['us', 'si']).default('us');

  const drawingUnitsOption = () =>
    new Option('--drawing-units <unit>', "the drawing's length unit (over the config's and the drawing header's)").choices(LENGTH_UNITS);
  const configOptions = (cmd: Command) =>
    cmd
      .option('--config <file>', 'config JSON (default: DRAWING.config.json beside it, else headcheck.json in its folder or a parent)')
      .option('--no-config', 'use no config file, only the defaults')
      .addOption(drawingUnitsOption());

  const requireHydraulicsOption = () =>
    new Option('--require-hydraulics', 'a drawing without piping or a source fed by it is unusable (exit 2), not a warning');
  const check = configOptions(program.command('check <drawing>').description('audit one drawing')).addOption(requireHydraulicsOption());
  for (const f of FORMAT_NAMES) check.option(`--${f} <file>`, `write ${FORMATS[f].description}`);
  check.option('--quiet', 'print only the summary line, not the error and warning findings');
  check.addOption(unitsOption()).action(async (drawing: string, opts: CheckOptions) => {
    code = await checkCommand(drawing, opts, io);
  });

  const compare = configOptions(
    program.command('compare <before> <after>').description('check two revisions of a drawing and say what was resolved, what is new'),
  ).addOption(requireHydraulicsOption());
  for (const f of COMPARE_FORMAT_NAMES) compare.option(`--${f} <file>`, `write ${COMPARE_FORMATS[f].description}`);
  compare.option('--quiet', 'print only the summary line, not the new findings');
  compare.addOption(unitsOption()).action(async (before: string, after: string, opts: CompareOptions) => {
    code = await compareCommand(before, after, opts, io);
  });

  const batch = program
    .command('batch <inputs...>')
    .description('audit many drawings (folders are searched for .dxf and .dwg files); one bad file never stops the rest')
    .requiredOption('--out <dir>', 'folder for the reports and summaries')
    .option('--config <file>', 'config JSON for drawings without their own')
    .addOption(drawingUnitsOption())
    .addOption(requireHydraulicsOption())
    .addOption(unitsOption())
    .option('--workers <n>', 'worker threads', String(availableParallelism()))
    .option('--time-limit <s>', 'seconds per drawing', '300')
    .option('--memory-limit <mb>', 'heap per worker, MB', '4096')
    .option('--force', 'check every drawing again, even unchanged ones')
    .option('--compare-with <dir>', 'a folder of the earlier revisions: each drawing is compared with the one at its relative path');
  for (const f of FORMAT_NAMES) {
    if (FORMATS[f].inBatch) batch.option(`--no-${f}`, `skip ${FORMATS[f].description} of each drawing`);
    else batch.option(`--${f}`, `write ${FORMATS[f].description} of each drawing too`);
  }
  batch.action(async (inputs: string[], opts: BatchCliOptions) => {
    const positive = (v: string, name: string) => {
      const n = Number(v);
      if (!Number.isFinite(n) || n <= 0) throw new InputError(`${name}: must be a positive number, not "${v}"`);
      return n;
    };
    const tty = process.stderr.isTTY === true;
    // The batch, server and demo modules load only for their command: a check's memory peak grows with the
    // code loaded (V8 sizes the heap by what is live), and the worker pool alone is several MB.
    const { runBatch } = await import('../batch/run-batch.js');
    // The main thread waits on the workers: an interrupt takes their temporary files with it.
    cleanUpOnSignals();
    const outcome = await runBatch({
      inputs,
      out: opts.out,
      ...(opts.config ? { config: opts.config } : {}),
      ...(opts.drawingUnits ? { drawingUnits: opts.drawingUnits } : {}),
      requireHydraulics: opts.requireHydraulics === true,
      units: opts.units,
      outputs: Object.fromEntries(FORMAT_NAMES.map((f) => [f, FORMATS[f].inBatch ? opts[f] !== false : opts[f] === true])) as Record<
        FormatName,
        boolean
      >,
      workers: Math.floor(positive(opts.workers, '--workers')),
      timeLimit: positive(opts.timeLimit, '--time-limit'),
      memoryLimit: positive(opts.memoryLimit, '--memory-limit'),
      force: opts.force === true,
      ...(opts.compareWith ? { compareWith: compareFolder(opts.compareWith) } : {}),
      workerFile: fileURLToPath(new URL('../batch/worker.js', import.meta.url)),
      progress: (line, final) => (tty ? process.stderr.write(`\r${line.padEnd(79)}${final ? '\n' : ''}`) : io.err(line)),
    });
    const count = (st: string) => outcome.rows.filter((r) => r.status === st).length;
    io.out(
      `batch: ${outcome.rows.length} drawings: ${count('pass')} pass, ${count('fail')} fail, ${count('error')} could not be checked; summary in ${join(opts.out, 'index.html')}`,
    );
    code = outcome.exitCode;
  });

  configOptions(program.command('layers <drawing>').description('list layers: what each holds, the role the tool would give it and why'))
    .option('--json <file>', 'write the same as JSON')
    .option('--config-out <file>', 'write a starter config with the roles chosen (check --config accepts it)')
    .action(async (drawing: string, opts: DrawingOptions & { json?: string; configOut?: string }) => {
      for (const o of [opts.json, opts.configOut]) if (o) assertNotInput(o, drawing);
      const settings = settingsFor(drawing, opts);
      const { bytes, dwgVersion } = await drawingBytes(drawing, settings, 'own-worker');
      const report = withFile(drawing, () => layersReport(bytes, settings, dwgVersion));
      const files: { path: string; data: string }[] = [];
      if (opts.json) files.push({ path: opts.json, data: `${JSON.stringify(report, null, 2)}\n` });
      if (opts.configOut) files.push({ path: opts.configOut, data: `${JSON.stringify(starterConfig(report, drawing), null, 2)}\n` });
      await writeAllAtomically(files);
      io.out(layersText(report));
    });

  program
    .command('serve')
    .description('local page: drop a drawing in, see the plan and the findings, download the outputs')
    .option('--port <n>', 'port (0: any free one)', '8377')
    .option('--host <address>', 'address to listen on', '127.0.0.1')
    .action(async (opts: { port: string; host: string }) => {
      const port = Number(opts.port);
      if (!Number.isInteger(port) || port < 0 || port > 65535) throw new InputError(`--port: must be a port number, not "${opts.port}"`);
      const { isLoopback, serve } = await import('../serve/server.js');
      if (!isLoopback(opts.host))
        io.err(`headcheck: warning: --host ${opts.host} serves the page to other machines; drawings dropped there are checked on this one`);
      const s = await serve(fileURLToPath(new URL('../web/', import.meta.url)), port, opts.host);
      io.out(`headcheck: the local page is at ${s.url} (the drawing stays on this machine; Ctrl-C stops)`);
      await new Promise<void>((done) =>
        process.once('SIGINT', () => {
          void s.close().then(done);
        }),
      );
    });

  program
    .command('demo')
    .description('build the bundled demo drawing and check it')
    .option('--out <dir>', 'folder for the demo drawing and its reports', 'headcheck-demo')
    .addOption(unitsOption())
    .action(async (opts: { out: string; units: UnitSystem }) => {
      const { demoDrawing, DEMO_CONFIG } = await import('../demo/scenario.js');
      try {
        mkdirSync(opts.out, { recursive: true });
      } catch (err) {
        throw new InputError(`${opts.out}: the folder cannot be created (${(err as NodeJS.ErrnoException).code ?? 'error'})`);
      }
      const dxfPath = join(opts.out, 'demo-plan.dxf');
      const configPath = join(opts.out, 'demo-plan.config.json');
      await writeAllAtomically([
        { path: dxfPath, data: demoDrawing() },
        { path: configPath, data: `${JSON.stringify(DEMO_CONFIG, null, 2)}\n` },
      ]);
      parseSettings(DEMO_CONFIG, configPath);
      const verdict = await checkCommand(
        dxfPath,
        {
          config: configPath,
          json: join(opts.out, 'demo-plan.json'),
          dxf: join(opts.out, 'demo-plan.annotated.dxf'),
          html: join(opts.out, 'demo-plan.html'),
          units: opts.units,
        },
        io,
      );
      io.out(
        `demo: drawing, config, JSON and HTML reports and the annotated drawing in ${opts.out}/ ` +
          `(the demo plan has planted findings: the check's own verdict would be exit ${verdict})`,
      );
      code = 0;
    });

  lookup.found = null;
  // The config a command found for itself is said on stderr: on its own line when the command ran, in the one
  // line of the error when it did not.
  try {
    await program.parseAsync(argv);
    const found = foundConfig();
    if (found) io.err(`headcheck: ${configSaid(found)}`);
    return code;
  } catch (err) {
    if (err instanceof CommanderError) return err.exitCode === 0 ? 0 : 2;
    if (err instanceof InputError) {
      const found = foundConfig();
      io.err(`headcheck: ${err.message}${found && !err.message.includes(found.path) ? ` [${configSaid(found)}]` : ''}`);
      return 2;
    }
    io.err(`headcheck: internal error: ${err instanceof Error ? err.message : String(err)}`);
    return 3;
  }
}
