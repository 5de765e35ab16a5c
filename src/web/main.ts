// The local page: takes a dropped drawing, builds a config from the form (remembered in this browser), runs
// the check in a Web Worker, shows the report and offers the outputs, re-checking whenever the inputs change.

import { LAYER_ROLES, type LayerRole } from '../config/names.js';
import { CAUTION } from '../outputs/caution.js';
import type { UnitSystem } from '../quantities/convert.js';
import type { CheckReply, CheckRequest } from './check-worker.js';

const $ = <T extends HTMLElement>(id: string) => document.getElementById(id) as T;
const form = $<HTMLFormElement>('settings');
const status = $('status');
const STORE = 'headcheck.settings';

$('caution').textContent = CAUTION;

let drawing: { name: string; bytes: ArrayBuffer } | null = null;
/** Roles the user set per layer; absent: the tool's guess. */
let roles: Record<string, LayerRole | ''> = {};
let worker: Worker | null = null;
const urls: string[] = [];

function restore(): void {
  try {
    const saved = JSON.parse(localStorage.getItem(STORE) ?? '{}') as Record<string, string>;
    for (const [k, v] of Object.entries(saved)) {
      const el = form.elements.namedItem(k) as HTMLInputElement | HTMLSelectElement | null;
      if (el) el.value = v;
    }
  } catch {
    // nothing remembered
  }
}

function remember(): void {
  const values: Record<string, string> = {};
  for (const el of Array.from(form.elements) as HTMLInputElement[]) if (el.name) values[el.name] = el.value;
  localStorage.setItem(STORE, JSON.stringify(values));
}

/** The config (contract keys) the form stands for; only filled-in values are set. */
function configFromForm(): Record<string, unknown> {
  const v = (name: string) => (form.elements.namedItem(name) as HTMLInputElement).value.trim();
  const num = (name: string) => (v(name) === '' ? undefined : Number(v(name)));
  const design: Record<string, unknown> = { hazard: v('hazard'), systemType: v('systemType') };
  if (num('density') !== undefined) design['density'] = num('density');
  if (num('area') !== undefined) design['area'] = num('area');
  const config: Record<string, unknown> = { design };
  // "OFFICE*=LH; *STORAGE*=OH2": zone label patterns and their hazard (the validator says what is wrong with one).
  const zones = v('zones')
    .split(';')
    .map((pair) => pair.split('=').map((x) => x.trim()))
    .filter(([pattern]) => pattern);
  if (zones.length)
    config['zones'] = Object.fromEntries(zones.map(([pattern, hazard]) => [pattern, { hazard: (hazard ?? '').toUpperCase() }]));
  const defaults: Record<string, unknown> = {};
  if (num('kFactor') !== undefined) defaults['kFactor'] = num('kFactor');
  if (v('pipeSize')) defaults['pipeSize'] = v('pipeSize');
  if (Object.keys(defaults).length) config['defaults'] = defaults;
  if ([num('static'), num('residual'), num('flow')].every((x) => x !== undefined)) {
    config['supply'] = { static: num('static'), residual: num('residual'), flow: num('flow') };
  }
  if (v('drawingUnits')) config['units'] = v('drawingUnits');
  const chosen = Object.entries(roles).filter(([, r]) => r !== undefined);
  if (chosen.length) {
    const layers: Partial<Record<LayerRole, string[]>> = {};
    for (const role of LAYER_ROLES) layers[role] = chosen.filter(([, r]) => r === role).map(([name]) => name);
    config['layers'] = layers;
  }
  return config;
}

function download(a: HTMLAnchorElement, name: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  urls.push(url);
  a.href = url;
  a.download = name;
}

function showLayers(layers: { name: string; counts: Record<string, number> }[], used: Record<LayerRole, string[]>): void {
  const box = $('layers');
  box.replaceChildren();
  for (const layer of layers) {
    const guessed = LAYER_ROLES.find((r) => used[r]?.includes(layer.name)) ?? '';
    const label = document.createElement('label');
    const counts =
      Object.entries(layer.counts)
        .map(([t, n]) => `${t} ${n}`)
        .join(', ') || 'empty';
    label.append(`${layer.name} (${counts}) `);
    const select = document.createElement('select');
    select.dataset['layer'] = layer.name;
    for (const option of ['', ...LAYER_ROLES]) {
      const o = document.createElement('option');
      o.value = option;
      o.textContent = option || '(none)';
      select.append(o);
    }
    select.value = roles[layer.name] ?? guessed;
    select.addEventListener('change', () => {
      // The first change fixes every layer's role as shown, so the others keep their guessed roles.
      for (const s of Array.from(box.querySelectorAll('select'))) roles[s.dataset['layer']!] = s.value as LayerRole | '';
      check();
    });
    label.append(select);
    box.append(label);
  }
  $('layers-box').hidden = false;
}

function check(): void {
  if (!drawing) return;
  remember();
  worker?.terminate();
  worker = new Worker(new URL('./check-worker.ts', import.meta.url), { type: 'module' });
  const started = performance.now();
  const config = configFromForm();
  const units = (form.elements.namedItem('units') as HTMLSelectElement).value as UnitSystem;
  status.textContent = `Checking ${drawing.name} …`;
  let dwgTimer: ReturnType<typeof setTimeout> | undefined;
  worker.onmessage = async (e: MessageEvent<CheckReply>) => {
    const m = e.data;
    clearTimeout(dwgTimer);
    if (m.type === 'reading-dwg') {
      status.textContent = `Reading ${drawing!.name} (DWG) …`;
      dwgTimer = setTimeout(() => {
        worker?.terminate();
        status.textContent = `${drawing!.name}: reading the DWG took longer than ${m.seconds} s (inputLimits.dwgSeconds)`;
        $('results').hidden = true;
      }, m.seconds * 1000);
      return;
    }
    if (m.type === 'progress') {
      status.textContent = `Checking ${drawing!.name}: ${m.stage} done (${((performance.now() - started) / 1000).toFixed(1)} s)`;
      return;
    }
    if (m.type === 'error') {
      status.textContent = m.message;
      $('results').hidden = true;
      return;
    }
    const text = (format: string) => m.outputs.find((o) => o.format === format)!.blob.text();
    const report = JSON.parse(await text('json')) as {
      summary: { pass: boolean; errors: number; warnings: number; heads: number };
      input: { layersUsed: Record<LayerRole, string[]> };
    };
    status.textContent = `Checked ${drawing!.name} in ${((performance.now() - started) / 1000).toFixed(1)} s.`;
    const verdict = $('verdict');
    verdict.className = report.summary.pass ? 'pass' : 'fail';
    verdict.textContent = `${report.summary.pass ? 'PASS' : 'FAIL'}: ${report.summary.heads} heads, ${report.summary.errors} errors, ${report.summary.warnings} warnings`;
    for (const u of urls.splice(0)) URL.revokeObjectURL(u);
    const base = drawing!.name.replace(/\.(dxf|dwg)$/i, '');
    const links = m.outputs.map((o) => {
      const a = document.createElement('a');
      a.id = `dl-${o.format}`;
      a.textContent = o.description.replace(/^the /, '');
      download(a, `${base}${o.extension}`, o.blob);
      return a;
    });
    $('downloads').replaceChildren('Download: ', ...links.flatMap((a) => [a, ' · ']), $('dl-config'));
    download(
      $<HTMLAnchorElement>('dl-config'),
      `${base}.config.json`,
      new Blob([`${JSON.stringify(config, null, 2)}\n`], { type: 'application/json' }),
    );
    $<HTMLIFrameElement>('report').srcdoc = await text('html');
    $('results').hidden = false;
    showLayers(m.layers, report.input.layersUsed);
  };
  const request: CheckRequest = { bytes: drawing.bytes.slice(0), fileName: drawing.name, config, units };
  worker.postMessage(request);
}

async function take(file: File): Promise<void> {
  drawing = { name: file.name, bytes: await file.arrayBuffer() };
  roles = {};
  check();
}

const drop = $('drop');
drop.addEventListener('dragover', (e) => {
  e.preventDefault();
  drop.classList.add('over');
});
drop.addEventListener('dragleave', () => drop.classList.remove('over'));
drop.addEventListener('drop', (e) => {
  e.preventDefault();
  drop.classList.remove('over');
  const file = e.dataTransfer?.files[0];
  if (file) void take(file);
});
$<HTMLInputElement>('file').addEventListener('change', (e) => {
  const file = (e.target as HTMLInputElement).files?.[0];
  if (file) void take(file);
});
form.addEventListener('change', (e) => {
  if (!(e.target as HTMLElement).closest('#layers')) check();
});
restore();
