// Garbage collection where a check's heap has grown large: full collections between its stages, inside its search
// and before each output (each leaves most of what it allocated behind), the design-area stage's heap held close.

import { runInNewContext } from 'node:vm';

/**
 * A collection (10-40 ms) pays where the heap has grown past this: a large drawing, or a small file with many
 * heads (2 MB holds 20,000); a small check never gets there.
 */
const LARGE_HEAP_BYTES = 64 * 2 ** 20;

/**
 * Stages after which most of what was allocated is garbage: the drawing's raw geometry (after the plan), the
 * network's scaffolding and the coverage search (after coverage), the design-area search's candidates and bounds
 * (after it, and by the report). Measured on the 25 MB bench drawing: peak 244-263 MiB without, 216-221 MiB with,
 * in the same time; on 20,000 heads in a 2 MB file (collected since the heap, not the file, decides): 292-317 →
 * 234-236 MiB for about 60 ms.
 */
const COLLECT_AFTER = new Set(['plan', 'coverage', 'design-area', 'report']);

let gc: (() => void) | null | undefined;

/**
 * V8's collector, reached by setting its --expose-gc flag at run time and reading `gc` from a new context; null where
 * refused or where Node lacks process.getBuiltinModule (before 20.16). node:v8 is loaded here, at the first
 * collection only: loading it cost a small check ~3 ms.
 */
function collector(): (() => void) | null {
  if (gc === undefined) {
    try {
      process.getBuiltinModule('node:v8').setFlagsFromString('--expose-gc');
      const found: unknown = runInNewContext('typeof gc === "function" ? gc : null');
      gc = typeof found === 'function' ? (found as () => void) : null;
    } catch {
      gc = null;
    }
  }
  return gc;
}

/** Whether the heap in use is past LARGE_HEAP_BYTES. */
const heapIsLarge = () => process.memoryUsage().heapUsed > LARGE_HEAP_BYTES;

/**
 * A full collection where the heap has grown large. Also inside the search, once the model of every head is built
 * (`onGarbage`): on 20,000 heads in lines of 8 under load the stage's end peaked at 219-231 MiB in some runs (V8's
 * concurrent marking behind the search), 193-211 with this collection (twenty-four runs each, alternated).
 */
export function collectIfLarge(): void {
  if (heapIsLarge()) collector()?.();
}

/**
 * Through the design-area stage (from the end of coverage, the stage before it), where the heap is large, V8 may grow
 * it by this share over what its last collection left live instead of its own factor (up to about 4×), so the search's
 * garbage is collected as it goes, by V8's concurrent marking. 20,000 heads in lines of 8, the command with every
 * output: peak 206-209 → 194-201 MiB, 2.59-2.69 → 2.67-2.88 s; set before the collection after coverage, whose new
 * limit it decides.
 */
const SEARCH_HEAP_GROWTH_PERCENT = 20;

/**
 * Whether the share above is set. It is a process's flag: the next check's first stage takes it off if one ended
 * early, and a batch's worker threads share it (a large drawing's search then holds the others' heaps close too).
 */
let held = false;

/** Sets V8's heap growing share (0: its own factor); false where node:v8 cannot be reached. */
function heapGrowth(percent: number): boolean {
  if (!collector()) return false;
  process.getBuiltinModule('node:v8').setFlagsFromString(`--heap-growing-percent=${percent}`);
  return true;
}

/**
 * A stage hook for runCheck: after the stages above, a full collection where the heap has grown large; and the
 * design-area stage run with the heap held closer to what is live.
 */
export function collectBetweenStages(): (stage: string) => void {
  return (stage) => {
    if (held) held = !heapGrowth(0);
    if (stage === 'coverage' && heapIsLarge()) held = heapGrowth(SEARCH_HEAP_GROWTH_PERCENT);
    if (COLLECT_AFTER.has(stage)) collectIfLarge();
  };
}
