import { entryIndex, packedEntries, packedTable, relaxMask, type PackedTable } from "./held-karp-table";

/**
 * Two threads on one Held–Karp table, split on the last stop s: a subset without s reads only
 * subsets without s, and a subset with s reads subsets with s plus one without it (itself minus s).
 * So the calling thread fills every row without s in increasing mask order, never waiting, and the
 * helper fills the rows with s in the same order, one step behind: before each block of masks it
 * waits (Atomics.wait) until the caller has passed the same masks minus s. Both keep the mask
 * order's locality (the rows just written are the ones read next). The caller then waits for the
 * helper, so heldKarp stays synchronous. The rows with s hold one stop more, so the helper has
 * ~54% of the work at 22 stops: at best 1.85× faster than one thread.
 *
 * The thread is started by lib/workers/held-karp-threads.ts and registered here, so this module
 * imports nothing Node-only and still runs in a browser (on one thread there).
 */

/** Below this the table fits in cache and one thread finishes before a hand-over would pay. */
export const SPLIT_MIN_STOPS = 18;
/** Masks between progress marks: rare enough to cost nothing, short enough to keep the helper close. */
const BLOCK = 1024;
/**
 * With no helper progress for this long it is taken as stuck (a block takes well under a
 * millisecond): the caller fills the rest itself. Rows are deterministic, so a late helper writing a
 * row again writes the same values.
 */
const STALL_MS = 2000;

// Control words: masks below CALLER_DONE are filled, and masks from `top` below HELPER_DONE.
const CALLER_DONE = 0;
const HELPER_DONE = 1;
const CONTROL_WORDS = 2;

export interface SplitJob {
  m: number;
  dp: Int32Array;
  into: Int32Array;
  control: Int32Array;
}

export interface SplitHelper {
  /** Loaded, waiting for a job and not written off. */
  ready(): boolean;
  /** Runs serveSplitJob(job) on the helper thread. */
  post(job: SplitJob): void;
  /** The helper stopped making progress: hand it nothing more. */
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
  return new Int32Array(new SharedArrayBuffer(4 * length));
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
  const control = shared(CONTROL_WORDS);
  h.post({ m, dp: t.dp, into: sharedInto, control });

  const top = 1 << (m - 1);
  const end = 2 * top;
  for (let from = 0; from < top; from += BLOCK) {
    fillBlock(t, from, from + BLOCK);
    Atomics.store(control, CALLER_DONE, from + BLOCK);
    Atomics.notify(control, CALLER_DONE);
    if (onProgress && (from & 0xffff) === 0)
      onProgress((from + Math.max(0, Atomics.load(control, HELPER_DONE) - top)) / end);
  }
  let done = Atomics.load(control, HELPER_DONE);
  while (done < end) {
    if (
      Atomics.wait(control, HELPER_DONE, done, STALL_MS) === "timed-out" &&
      Atomics.load(control, HELPER_DONE) === done
    ) {
      h.lost();
      fillBlock(t, Math.max(done, top), end);
      break;
    }
    done = Atomics.load(control, HELPER_DONE);
  }
  return t;
}

/** The helper thread's side: fills the rows with the last stop, behind the caller. */
export function serveSplitJob(job: SplitJob): void {
  const { m, control } = job;
  const t = packedTable(m, job.into, job.dp);
  const top = 1 << (m - 1);
  for (let from = top; from < 2 * top; from += BLOCK) {
    const need = from + BLOCK - top;
    for (let done = Atomics.load(control, CALLER_DONE); done < need; done = Atomics.load(control, CALLER_DONE))
      Atomics.wait(control, CALLER_DONE, done);
    fillBlock(t, from, from + BLOCK);
    Atomics.store(control, HELPER_DONE, from + BLOCK);
    Atomics.notify(control, HELPER_DONE);
  }
}

function fillBlock(t: PackedTable, from: number, to: number): void {
  for (let mask = from; mask < to; mask++) if ((mask & (mask - 1)) !== 0) relaxMask(t, mask);
}
