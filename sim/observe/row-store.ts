/**
 * Rows of numbers (one per recorded time) kept to a fixed budget however many steps a run takes, so a record's memory
 * does not grow with the step count.
 *
 * Uniform part: every row whose sequence number is a multiple of `stride`. When the budget fills, the rows that are not
 * multiples of 2·stride are dropped and the stride doubles (decimation by halving). The kept rows stay evenly spread
 * over the steps, which puts more of them where the solver took more, shorter steps: where things change fast.
 * Held part: rows a caller needs exactly (a layer's peak, the two points around an event crossing) are copied to a
 * pool and kept by reference count, outside the budget. The latest row is always kept (the end of the run).
 * finish() merges the three in sequence order, each row once.
 */

export class RowStore {
  readonly width: number;
  private readonly budget: number;
  private readonly uniform: Float64Array;
  private readonly uniformSeq: Float64Array;
  private uniformCount = 0;
  private stride = 1;
  private seq = -1;
  private write: Float64Array;
  private latest: Float64Array;
  private previous: Float64Array;
  private readonly pool: Float64Array;
  private readonly poolSeq: Float64Array;
  private readonly refs: Int32Array;
  private readonly free: number[] = [];
  private latestSlot = -1;
  private previousSlot = -1;

  /**
   * @param width  numbers per row
   * @param budget rows kept by decimation (0: none, only held rows and the latest)
   * @param poolRows rows that may be held at once
   */
  constructor(width: number, budget: number, poolRows: number) {
    this.width = width;
    this.budget = budget;
    this.uniform = new Float64Array(budget * width);
    this.uniformSeq = new Float64Array(budget);
    this.write = new Float64Array(width);
    this.latest = new Float64Array(width);
    this.previous = new Float64Array(width);
    this.pool = new Float64Array(poolRows * width);
    this.poolSeq = new Float64Array(poolRows);
    this.refs = new Int32Array(poolRows);
    for (let s = poolRows - 1; s >= 0; s--) this.free.push(s);
  }

  /** The row being written: fill it, then commit(). A new buffer after every commit. */
  get row(): Float64Array { return this.write; }

  /** How many rows have been committed. */
  get committed(): number { return this.seq + 1; }

  /** The row written since the last commit becomes the latest row. */
  commit(): void {
    const spare = this.previous;
    this.previous = this.latest;
    this.latest = this.write;
    this.write = spare;
    this.previousSlot = this.latestSlot;
    this.latestSlot = -1;
    const seq = ++this.seq;
    if (this.budget === 0) return;
    if (seq % this.stride !== 0) return;
    if (this.uniformCount === this.budget) {
      this.decimate();
      if (seq % this.stride !== 0) return;
    }
    this.uniform.set(this.latest, this.uniformCount * this.width);
    this.uniformSeq[this.uniformCount] = seq;
    this.uniformCount++;
  }

  private decimate(): void {
    const keep = 2 * this.stride;
    let kept = 0;
    for (let r = 0; r < this.uniformCount; r++) {
      const s = this.uniformSeq[r]!;
      if (s % keep !== 0) continue;
      if (kept !== r) this.uniform.copyWithin(kept * this.width, r * this.width, (r + 1) * this.width);
      this.uniformSeq[kept++] = s;
    }
    this.uniformCount = kept;
    this.stride = keep;
  }

  /**
   * Holds the latest (or the one before it) committed row until released; returns its slot, or −1 if there is no such
   * row or the pool is full. Holding a row twice shares the slot (release it twice).
   */
  hold(which: 'latest' | 'previous'): number {
    const isLatest = which === 'latest';
    if (isLatest ? this.seq < 0 : this.seq < 1) return -1;
    const cached = isLatest ? this.latestSlot : this.previousSlot;
    if (cached >= 0) {
      this.refs[cached]!++;
      return cached;
    }
    const slot = this.free.pop();
    if (slot === undefined) return -1;
    this.pool.set(isLatest ? this.latest : this.previous, slot * this.width);
    this.poolSeq[slot] = isLatest ? this.seq : this.seq - 1;
    this.refs[slot] = 1;
    if (isLatest) this.latestSlot = slot;
    else this.previousSlot = slot;
    return slot;
  }

  release(slot: number): void {
    if (slot < 0) return;
    if (--this.refs[slot]! > 0) return;
    this.free.push(slot);
    if (this.latestSlot === slot) this.latestSlot = -1;
    if (this.previousSlot === slot) this.previousSlot = -1;
  }

  /** Every kept row in sequence order, each once, flat (rows × width). Empty before the first commit. */
  finish(): { readonly rows: number; readonly data: Float64Array } {
    const order: { seq: number; from: Float64Array; at: number }[] = [];
    for (let r = 0; r < this.uniformCount; r++) order.push({ seq: this.uniformSeq[r]!, from: this.uniform, at: r * this.width });
    for (let s = 0; s < this.refs.length; s++) {
      if (this.refs[s]! > 0) order.push({ seq: this.poolSeq[s]!, from: this.pool, at: s * this.width });
    }
    if (this.seq >= 0) order.push({ seq: this.seq, from: this.latest, at: 0 });
    order.sort((a, b) => a.seq - b.seq);
    const data = new Float64Array(order.length * this.width);
    let rows = 0;
    let lastSeq = -1;
    for (const o of order) {
      if (o.seq === lastSeq) continue;
      data.set(o.from.subarray(o.at, o.at + this.width), rows * this.width);
      rows++;
      lastSeq = o.seq;
    }
    return { rows, data: rows * this.width === data.length ? data : data.slice(0, rows * this.width) };
  }
}
