import {
  entryIndex,
  nextCombination,
  packedEntries,
  packedTable,
  relaxMask,
  type PackedTable,
} from "./held-karp-table";

/**
 * Two threads on one Held–Karp table. Subsets are filled layer by layer (by size): a subset reads
 * only subsets one smaller, so within a layer every row is independent. Each layer is cut into
 * chunks of consecutive same-size masks; both threads claim chunks from a shared counter and the
 * caller waits (Atomics.wait) until the layer is done before opening the next, so heldKarp stays
 * synchronous. The thread itself is started by lib/workers/held-karp-threads.ts and registered
 * here, so this module imports nothing Node-only and still runs in a browser (one thread there).
 */

/** Below this the table fits in cache and one thread finishes before a hand-over would pay. */
export const SPLIT_MIN_STOPS = 18;
/** Masks per chunk: small enough to balance the two threads, large enough that claims are rare. */
const CHUNK = 256;
/**
 * With no chunk finished for this long the helper is taken as stuck (a chunk takes microseconds):
 * the caller redoes its unfinished chunks. Rows are deterministic, so a late helper writing the
 * same row again writes the same values.
 */
const STALL_MS = 2000;

// Control words (Int32 indices); chunk indices count up across all layers and never reset.
const LAYER = 0; // layer open for claims; -1 once the table is full
const END = 1; // chunks below this index may be claimed
const CLAIM = 2; // next chunk to claim
const DONE = 3; // chunks finished
const CONTROL_WORDS = 4;

export interface SplitJob {
  m: number;
  dp: Int32Array;
  into: Int32Array;
  control: Int32Array;
  chunkStart: Int32Array;
  chunkLength: Int32Array;
  chunkDone: Int32Array;
}

export interface SplitHelper {
  /** Loaded, waiting for a job and not written off. */
  ready(): boolean;
  /** Runs serveSplitJob(job) on the helper thread. */
  post(job: SplitJob): void;
  /** The helper missed a barrier: hand it nothing more. */
  lost(): void;
}

let helper: SplitHelper | null = null;

export function setSplitHelper(h: SplitHelper | null): void {
  helper = h;
}

/** The registered helper, so a bench can set it aside for one-thread runs and put it back. */
export function splitHelper(): SplitHelper | null {
  return helper;
}

/** Whether heldKarp on m stops would split the table over two threads right now. */
export function heldKarpSplits(m: number): boolean {
  return m >= SPLIT_MIN_STOPS && helper !== null && helper.ready();
}

function shared(length: number): Int32Array {
  return new Int32Array(new SharedArrayBuffer(4 * Math.max(1, length)));
}

/** Fills the table on two threads, or returns null when no helper is ready (the caller uses one). */
export function splitFill(
  m: number,
  into: Int32Array,
  fromStart: (j: number) => number,
  onProgress?: (fraction: number) => void,
): PackedTable | null {
  const h = helper;
  if (!h || !heldKarpSplits(m)) return null;

  const sharedInto = shared(into.length);
  sharedInto.set(into);
  const t = packedTable(m, sharedInto, shared(packedEntries(m)));
  for (let j = 0; j < m; j++) t.dp[entryIndex(t, 1 << j, j)] = fromStart(j);
  const plan = chunkPlan(m);
  const job: SplitJob = { m, dp: t.dp, into: sharedInto, control: shared(CONTROL_WORDS), ...plan.chunks };
  const { control } = job;
  h.post(job);

  let masksDone = m;
  for (let k = 2; k <= m; k++) {
    const end = plan.layerEnd[k] as number;
    Atomics.store(control, END, end);
    Atomics.store(control, LAYER, k);
    Atomics.notify(control, LAYER);
    claimChunks(job, t);
    if (!awaitLayer(control, end)) {
      h.lost();
      for (let g = plan.layerEnd[k - 1] as number; g < end; g++) runChunk(job, t, g);
    }
    masksDone += plan.layerMasks[k] as number;
    onProgress?.(masksDone / 2 ** m);
  }
  Atomics.store(control, LAYER, -1);
  Atomics.notify(control, LAYER);
  return t;
}

/** The helper thread's side: claims chunks of each layer as it opens, until the table is full. */
export function serveSplitJob(job: SplitJob): void {
  const t = packedTable(job.m, job.into, job.dp);
  let seen = 0;
  while (true) {
    Atomics.wait(job.control, LAYER, seen);
    const layer = Atomics.load(job.control, LAYER);
    if (layer < 0) return;
    seen = layer;
    claimChunks(job, t);
    Atomics.notify(job.control, DONE);
  }
}

function claimChunks(job: SplitJob, t: PackedTable): void {
  const { control } = job;
  while (true) {
    const g = Atomics.load(control, CLAIM);
    if (g >= Atomics.load(control, END)) return;
    // compareExchange, not add: an add past END would take a chunk of a layer not yet open.
    if (Atomics.compareExchange(control, CLAIM, g, g + 1) !== g) continue;
    runChunk(job, t, g);
    Atomics.add(control, DONE, 1);
  }
}

function runChunk(job: SplitJob, t: PackedTable, g: number): void {
  let mask = job.chunkStart[g] as number;
  for (let n = job.chunkLength[g] as number; n > 0; n--) {
    relaxMask(t, mask);
    mask = nextCombination(mask);
  }
  job.chunkDone[g] = 1;
}

/** Waits until every chunk below end is done; false if the helper stalled (its chunks are then redone). */
function awaitLayer(control: Int32Array, end: number): boolean {
  while (true) {
    const done = Atomics.load(control, DONE);
    if (done >= end) return true;
    if (Atomics.wait(control, DONE, done, STALL_MS) === "timed-out" && Atomics.load(control, DONE) === done)
      return false;
  }
}

interface ChunkPlan {
  chunks: Pick<SplitJob, "chunkStart" | "chunkLength" | "chunkDone">;
  /** layerEnd[k]: first chunk index past layer k (layer 1 holds no chunks: its rows are the arcs from start). */
  layerEnd: Int32Array;
  layerMasks: Int32Array;
}

/** Cuts each layer 2..m, masks in increasing order (Gosper's hack), into chunks of CHUNK masks. */
function chunkPlan(m: number): ChunkPlan {
  const layerMasks = new Int32Array(m + 1);
  layerMasks[0] = 1;
  for (let k = 1; k <= m; k++) layerMasks[k] = ((layerMasks[k - 1] as number) * (m - k + 1)) / k;
  const layerEnd = new Int32Array(m + 1);
  let total = 0;
  for (let k = 2; k <= m; k++) {
    total += Math.ceil((layerMasks[k] as number) / CHUNK);
    layerEnd[k] = total;
  }
  layerEnd[1] = 0;
  const chunkStart = shared(total);
  const chunkLength = shared(total);
  let g = 0;
  for (let k = 2; k <= m; k++) {
    let mask = (1 << k) - 1;
    for (let left = layerMasks[k] as number; left > 0; left -= CHUNK) {
      chunkStart[g] = mask;
      chunkLength[g] = Math.min(CHUNK, left);
      if (left > CHUNK) for (let s = 0; s < CHUNK; s++) mask = nextCombination(mask);
      g++;
    }
  }
  return { chunks: { chunkStart, chunkLength, chunkDone: shared(total) }, layerEnd, layerMasks };
}
