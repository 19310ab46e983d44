import { UNREACHABLE } from "./constants";
import type { CostMatrix } from "./cost-matrix";
import { arcCost, walkLength } from "./cost-matrix";
import type { PathResult } from "./held-karp";
import { mulberry32, randomInt } from "./random";

export interface HeuristicOptions {
  /** Seed for the perturbation kicks; the same seed and budget give the same result. */
  seed?: number;
  /** Perturbation rounds after the first descent. */
  kicks?: number;
  /** Optional wall-clock cap in ms; makes results depend on machine speed, so off by default. */
  timeLimitMs?: number;
}

// Missing arcs get a huge finite cost so moves can be compared; any tour still using one is infeasible.
const PENALTY = 1e12;

/**
 * Local positions: 0 = start, 1..m = stops, m+1 = end. w is dense (m+2)^2, Float64 so penalised
 * sums stay exact (integers below 2^53).
 */
function localCosts(cm: CostMatrix, start: number, end: number, stops: readonly number[]): Float64Array {
  const pts = [start, ...stops, end];
  const k = pts.length;
  const w = new Float64Array(k * k);
  for (let a = 0; a < k; a++) {
    for (let b = 0; b < k; b++) {
      if (a === b) continue;
      const c = arcCost(cm, pts[a] as number, pts[b] as number);
      w[a * k + b] = c >= UNREACHABLE ? PENALTY : c;
    }
  }
  return w;
}

function nearestNeighbour(w: Float64Array, m: number): Int32Array {
  const k = m + 2;
  const seq = new Int32Array(k);
  const used = new Uint8Array(k);
  seq[0] = 0;
  seq[k - 1] = k - 1;
  let at = 0;
  for (let pos = 1; pos <= m; pos++) {
    let best = -1;
    let bestCost = Infinity;
    for (let s = 1; s <= m; s++) {
      const c = w[at * k + s] as number;
      if (!used[s] && c < bestCost) {
        bestCost = c;
        best = s;
      }
    }
    used[best] = 1;
    seq[pos] = best;
    at = best;
  }
  return seq;
}

function seqLength(w: Float64Array, seq: Int32Array): number {
  const k = seq.length;
  let t = 0;
  for (let i = 0; i + 1 < k; i++) t += w[(seq[i] as number) * k + (seq[i + 1] as number)] as number;
  return t;
}

/**
 * 2-opt on a directed path: reversing seq[i..j] flips the direction of every arc inside it, so
 * its new cost is read from backward prefix sums rather than assumed equal to the forward one.
 */
function twoOpt(w: Float64Array, seq: Int32Array, fwd: Float64Array, bwd: Float64Array): boolean {
  const k = seq.length;
  prefixSums(w, seq, fwd, bwd);
  for (let i = 1; i < k - 2; i++) {
    const a = seq[i - 1] as number;
    const si = seq[i] as number;
    for (let j = i + 1; j < k - 1; j++) {
      const sj = seq[j] as number;
      const b = seq[j + 1] as number;
      const before = (w[a * k + si] as number) + ((fwd[j] as number) - (fwd[i] as number)) + (w[sj * k + b] as number);
      const after = (w[a * k + sj] as number) + ((bwd[j] as number) - (bwd[i] as number)) + (w[si * k + b] as number);
      if (after < before) {
        seq.subarray(i, j + 1).reverse();
        return true;
      }
    }
  }
  return false;
}

/** fwd[t] = cost of seq[0..t] walked forwards; bwd[t] = the same arcs walked backwards. */
function prefixSums(w: Float64Array, seq: Int32Array, fwd: Float64Array, bwd: Float64Array): void {
  const k = seq.length;
  fwd[0] = 0;
  bwd[0] = 0;
  for (let t = 1; t < k; t++) {
    const p = seq[t - 1] as number;
    const q = seq[t] as number;
    fwd[t] = (fwd[t - 1] as number) + (w[p * k + q] as number);
    bwd[t] = (bwd[t - 1] as number) + (w[q * k + p] as number);
  }
}

/** Or-opt: move a run of 1–3 stops elsewhere, kept in order or reversed (each priced on directed arcs). */
function orOpt(w: Float64Array, seq: Int32Array, fwd: Float64Array, bwd: Float64Array): boolean {
  const k = seq.length;
  const m = k - 2;
  prefixSums(w, seq, fwd, bwd);
  for (let len = 1; len <= 3 && len <= m; len++) {
    for (let i = 1; i + len - 1 <= m; i++) {
      const e = i + len - 1;
      const p = seq[i - 1] as number;
      const s0 = seq[i] as number;
      const se = seq[e] as number;
      const nx = seq[e + 1] as number;
      const gain = (w[p * k + s0] as number) + (w[se * k + nx] as number) - (w[p * k + nx] as number);
      const inF = (fwd[e] as number) - (fwd[i] as number);
      const inB = (bwd[e] as number) - (bwd[i] as number);
      for (let q = 0; q < k - 1; q++) {
        if (q >= i - 1 && q <= e) continue;
        const a = seq[q] as number;
        const b = seq[q + 1] as number;
        const base = w[a * k + b] as number;
        const addF = (w[a * k + s0] as number) + (w[se * k + b] as number) - base;
        const addR = (w[a * k + se] as number) + inB - inF + (w[s0 * k + b] as number) - base;
        const reversed = addR < addF;
        if (Math.min(addF, addR) - gain < 0) {
          moveRun(seq, i, e, q, reversed);
          return true;
        }
      }
    }
  }
  return false;
}

function moveRun(seq: Int32Array, i: number, e: number, q: number, reversed: boolean): void {
  const run = Array.from(seq.subarray(i, e + 1));
  if (reversed) run.reverse();
  const rest = [...Array.from(seq.subarray(0, i)), ...Array.from(seq.subarray(e + 1))];
  // q indexes the original sequence; once the run is cut out, positions after it shift left.
  const at = q < i ? q + 1 : q + 1 - run.length;
  seq.set([...rest.slice(0, at), ...run, ...rest.slice(at)]);
}

function descend(
  w: Float64Array,
  seq: Int32Array,
  fwd: Float64Array,
  bwd: Float64Array,
  outOfTime: () => boolean,
): void {
  while (!outOfTime() && (orOpt(w, seq, fwd, bwd) || twoOpt(w, seq, fwd, bwd))) {
    // keep applying improving moves until neither neighbourhood has one
  }
}

/** Double bridge for paths: swap two adjacent runs, keeping their direction (safe on directed costs). */
function kick(seq: Int32Array, rand: () => number): Int32Array {
  const m = seq.length - 2;
  const cuts = [randomInt(rand, 1, m), randomInt(rand, 1, m), randomInt(rand, 1, m)].sort((x, y) => x - y);
  const [a, b, c] = cuts as [number, number, number];
  const arr = Array.from(seq);
  const out = [...arr.slice(0, a), ...arr.slice(b, c + 1), ...arr.slice(a, b), ...arr.slice(c + 1)];
  return Int32Array.from(out);
}

/** Nearest neighbour, then Or-opt and 2-opt descent with seeded kicks. Never claims optimality. */
export function localSearch(
  cm: CostMatrix,
  start: number,
  end: number,
  stops: readonly number[],
  options: HeuristicOptions = {},
): PathResult {
  const m = stops.length;
  if (m === 0) return { order: [], length: walkLength(cm, start, [], end) };
  const w = localCosts(cm, start, end, stops);
  const fwd = new Float64Array(m + 2);
  const bwd = new Float64Array(m + 2);
  const started = Date.now();
  const outOfTime = () => options.timeLimitMs !== undefined && Date.now() - started > options.timeLimitMs;

  let best = nearestNeighbour(w, m);
  descend(w, best, fwd, bwd, outOfTime);
  let bestLen = seqLength(w, best);
  const rand = mulberry32(options.seed ?? 1);
  const kicks = m < 4 ? 0 : (options.kicks ?? 60);
  for (let r = 0; r < kicks && !outOfTime(); r++) {
    const trial = kick(best, rand);
    descend(w, trial, fwd, bwd, outOfTime);
    const len = seqLength(w, trial);
    if (len < bestLen) {
      best = trial;
      bestLen = len;
    }
  }
  const order = Array.from(best.subarray(1, m + 1), (s) => stops[s - 1] as number);
  return { order, length: walkLength(cm, start, order, end) };
}
