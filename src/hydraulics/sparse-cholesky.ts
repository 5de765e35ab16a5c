// A sparse symmetric positive-definite solver for the network equations: minimum-degree ordering, symbolic
// factorisation once per structure, then numeric LDLᵀ per solve, of all unknowns or of a set of them that nothing
// couples to the rest (the live part of a large system). Zero fill on trees; little on grids.

export class SparseSpdSystem {
  readonly n: number;
  /** Elimination position of each original index, and the original index at each position. */
  private readonly pos: Int32Array;
  private readonly order: Int32Array;
  /** Column j of L (elimination order): its rows colRows[colStart[j] .. colStart[j+1]) and their value slots. */
  private readonly colStart: Int32Array;
  private readonly colRows: Int32Array;
  private readonly colSlot: Int32Array;
  /** Slot of each diagonal entry; off-diagonal slots follow in `values`. */
  private readonly diagSlot: Int32Array;
  /** Right-looking updates of each column: target slot, and the two L slots multiplied. */
  private readonly updStart: Int32Array;
  private readonly updTarget: Int32Array;
  private readonly updA: Int32Array;
  private readonly updB: Int32Array;
  private readonly slotOf: Map<number, number>;
  private readonly values: Float64Array;
  /** Work vector of the triangular solves, in elimination order. */
  private readonly work: Float64Array;
  /** 0 … n − 1: every column. */
  private readonly everyColumn: Int32Array;

  /** @param edges pairs of original indices with a non-zero off-diagonal entry */
  constructor(n: number, edges: readonly (readonly [number, number])[]) {
    this.n = n;
    const { order, structure } = minimumDegree(n, edges);
    this.pos = new Int32Array(n);
    this.order = Int32Array.from(order);
    order.forEach((v, j) => {
      this.pos[v] = j;
    });
    this.diagSlot = Int32Array.from({ length: n }, (_, j) => j);
    this.colStart = new Int32Array(n + 1);
    const rows: number[] = [];
    const slots: number[] = [];
    let next = n;
    this.slotOf = new Map();
    for (let j = 0; j < n; j++) {
      const r = structure[j]!.map((v) => this.pos[v]!).sort((a, b) => a - b);
      for (const i of r) {
        rows.push(i);
        slots.push(next);
        this.slotOf.set(i * n + j, next);
        next++;
      }
      this.colStart[j + 1] = rows.length;
    }
    this.colRows = Int32Array.from(rows);
    this.colSlot = Int32Array.from(slots);
    this.values = new Float64Array(next);
    this.work = new Float64Array(n);
    this.everyColumn = Int32Array.from({ length: n }, (_, j) => j);
    // Updates: eliminating column j changes entry (a, b) for every pair of its rows a ≥ b (a = b: diagonal).
    const target: number[] = [];
    const ua: number[] = [];
    const ub: number[] = [];
    this.updStart = new Int32Array(n + 1);
    for (let j = 0; j < n; j++) {
      for (let x = this.colStart[j]!; x < this.colStart[j + 1]!; x++) {
        for (let y = this.colStart[j]!; y <= x; y++) {
          const a = this.colRows[x]!;
          const b = this.colRows[y]!;
          target.push(a === b ? this.diagSlot[a]! : this.slotOf.get(a * n + b)!);
          ua.push(this.colSlot[x]!);
          ub.push(this.colSlot[y]!);
        }
      }
      this.updStart[j + 1] = target.length;
    }
    this.updTarget = Int32Array.from(target);
    this.updA = Int32Array.from(ua);
    this.updB = Int32Array.from(ub);
  }

  /** Entries of L (diagonal included), a measure of the factorisation's cost. */
  get nonZeros(): number {
    return this.values.length;
  }

  /**
   * The columns (elimination positions, in order) of some unknowns (original indices), for `clear` and `solve` to
   * work on those alone.
   */
  columnsOf(indices: ArrayLike<number>): Int32Array {
    return Int32Array.from(indices, (i) => this.pos[i]!).sort();
  }

  /** Sets the matrix to zero: every entry, or those of the given columns. */
  clear(columns: Int32Array | null = null): void {
    if (!columns) {
      this.values.fill(0);
      return;
    }
    const { values: v, colStart, colSlot, diagSlot } = this;
    for (const j of columns) {
      v[diagSlot[j]!] = 0;
      for (let x = colStart[j]!; x < colStart[j + 1]!; x++) v[colSlot[x]!] = 0;
    }
  }

  /** Adds v to entry (i, j) and (j, i) of the matrix, original indices (only entries given as edges, or diagonal). */
  add(i: number, j: number, v: number): void {
    this.values[this.slot(i, j)]! += v;
  }

  /** Where entry (i, j) (and (j, i)) is kept, for repeated `addAt` without a lookup. */
  slot(i: number, j: number): number {
    let a = this.pos[i]!;
    let b = this.pos[j]!;
    if (a === b) return this.diagSlot[a]!;
    if (a < b) [a, b] = [b, a];
    const slot = this.slotOf.get(a * this.n + b);
    if (slot === undefined) throw new Error(`entry (${i}, ${j}) is not in the structure`);
    return slot;
  }

  addAt(slot: number, v: number): void {
    this.values[slot]! += v;
  }

  /**
   * Factorises in place (LDLᵀ) and solves A·x = b (original indices) into `out` (a new array when not given).
   * Given `columns`, only those: no entry may couple them to the other unknowns (whose entries are then neither
   * read nor changed, and whose places in `out` keep what they held). Throws if A is not positive definite.
   */
  solve(b: Float64Array, out = new Float64Array(this.n), columns: Int32Array | null = null): Float64Array {
    const { values: v, colStart, colRows, colSlot, diagSlot, updStart, updTarget, updA, updB, order } = this;
    const cols = columns ?? this.everyColumn;
    for (const j of cols) {
      const d = v[diagSlot[j]!]!;
      if (!(d > 0)) throw new Error('network matrix is not positive definite (a part of the network has no fixed pressure)');
      // The updates use L·d·L with L = a/d: multiply the raw entries and divide by d once.
      for (let u = updStart[j]!; u < updStart[j + 1]!; u++) v[updTarget[u]!]! -= (v[updA[u]!]! * v[updB[u]!]!) / d;
      for (let x = colStart[j]!; x < colStart[j + 1]!; x++) v[colSlot[x]!]! /= d;
    }
    // Rows outside the columns are reached below only through entries that are zero: they start at 0 (not at what
    // an earlier solve left, which a failed one may have left not finite).
    const y = this.work;
    if (columns) for (const j of cols) for (let x = colStart[j]!; x < colStart[j + 1]!; x++) y[colRows[x]!] = 0;
    for (const j of cols) y[j] = b[order[j]!]!;
    for (const j of cols) {
      const yj = y[j]!;
      for (let x = colStart[j]!; x < colStart[j + 1]!; x++) y[colRows[x]!]! -= v[colSlot[x]!]! * yj;
    }
    for (const j of cols) y[j] = y[j]! / v[diagSlot[j]!]!;
    for (let k = cols.length - 1; k >= 0; k--) {
      const j = cols[k]!;
      let s = y[j]!;
      for (let x = colStart[j]!; x < colStart[j + 1]!; x++) s -= v[colSlot[x]!]! * y[colRows[x]!]!;
      y[j] = s;
    }
    for (const j of cols) out[order[j]!] = y[j]!;
    return out;
  }
}

/**
 * Minimum-degree elimination order, and the structure of each column of L (the neighbours a vertex has when it
 * is eliminated, as original indices). Ties go to the lowest index, so the order is deterministic.
 */
function minimumDegree(n: number, edges: readonly (readonly [number, number])[]): { order: number[]; structure: number[][] } {
  const adj: Set<number>[] = Array.from({ length: n }, () => new Set());
  for (const [a, b] of edges)
    if (a !== b) {
      adj[a]!.add(b);
      adj[b]!.add(a);
    }
  const degree = new Int32Array(n);
  // Vertices keyed degree · n + index, the least on top (a binary heap): the next to eliminate, ties to the lowest
  // index. A key goes stale once its vertex is eliminated or its degree changes, and is skipped when it comes up (a
  // scan of the lowest degree's vertices for the lowest index took 68 ms of a profile on 20,000 heads in lines of 8).
  const heap: number[] = [];
  const push = (key: number) => {
    let i = heap.length;
    heap.push(key);
    while (i > 0) {
      const up = (i - 1) >> 1;
      if (heap[up]! <= key) break;
      heap[i] = heap[up]!;
      i = up;
    }
    heap[i] = key;
  };
  const pop = (): number => {
    const top = heap[0]!;
    const last = heap.pop()!;
    if (heap.length) {
      let i = 0;
      for (;;) {
        let c = 2 * i + 1;
        if (c >= heap.length) break;
        if (c + 1 < heap.length && heap[c + 1]! < heap[c]!) c++;
        if (heap[c]! >= last) break;
        heap[i] = heap[c]!;
        i = c;
      }
      heap[i] = last;
    }
    return top;
  };
  const place = (v: number) => {
    degree[v] = adj[v]!.size;
    push(degree[v]! * n + v);
  };
  for (let v = 0; v < n; v++) place(v);
  const done = new Uint8Array(n);
  const order: number[] = [];
  const structure: number[][] = [];
  for (let k = 0; k < n; k++) {
    let v: number;
    for (;;) {
      const key = pop();
      v = key % n;
      if (!done[v] && degree[v]! === (key - v) / n) break;
    }
    done[v] = 1;
    const nb = [...adj[v]!];
    order.push(v);
    structure.push(nb);
    for (const a of nb) {
      adj[a]!.delete(v);
      for (const b of nb) if (a !== b) adj[a]!.add(b);
    }
    for (const a of nb) place(a);
  }
  return { order, structure };
}
