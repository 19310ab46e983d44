import { edgeOptions } from "./edge-options";
import type { CorridorInstance } from "./instance";
import { StateLayer } from "./state-layer";
import type { SweepPlan } from "./sweep-order";

/** Front positions one state can encode: 5 bits each (component id and parity), split over two int32 halves. */
export const MAX_FRONT_WIDTH = 10;
const PER_HALF = 6;

export type SweepOutcome = { costMm: number; uses: Uint8Array } | { tooManyStates: true };

// Component ids given to nodes touched for the first time by the current edge; normalised ids stay ≤ 10.
const FRESH_U = 14;
const FRESH_V = 15;

/**
 * The sweep itself. A front position holds 0 (untouched) or (component << 1 | degree parity);
 * components are renumbered by first appearance so equal fronts encode equally.
 */
export function runSweep(inst: CorridorInstance, plan: SweepPlan, maxStates: number): SweepOutcome {
  const { steps } = plan;
  const n = steps.length;
  // Requirements still to meet after step i: required nodes not yet on the front, edges holding stops.
  const ahead = new Int32Array(n + 1);
  for (let i = n - 1; i >= 0; i--) {
    const st = steps[i]!;
    let k = inst.edges[st.edge]!.stops.length > 0 ? 1 : 0;
    for (let p = st.prevWidth; p < st.work.length; p++) if (inst.required[st.work[p]!]) k++;
    ahead[i] = ahead[i + 1]! + k;
  }

  const parents: Int32Array[] = [];
  const usesAt: Uint8Array[] = [];
  let layer = new StateLayer(1);
  layer.offer(0, 0, 0, -1, 0);
  let bestCost = Infinity;
  let bestStep = -1;
  let bestParent = -1;
  let bestUse = 0;
  const base = new Int32Array(16);
  const t = new Int32Array(16);
  const removed = new Uint8Array(16);
  // remap[c] is valid only where seen[c] holds the current stamp, so it never needs clearing.
  const remap = new Int32Array(16);
  const seen = new Int32Array(16);
  let stamp = 0;
  const req = new Uint8Array(16);
  const odd = new Uint8Array(16);

  for (let i = 0; i < n; i++) {
    const st = steps[i]!;
    const opts = edgeOptions(inst.edges[st.edge]!);
    const w = st.work.length;
    const pw = st.prevWidth;
    const { uPos, vPos, leaving } = st;
    for (let q = 0; q < w; q++) {
      req[q] = inst.required[st.work[q]!]!;
      odd[q] = inst.oddTarget[st.work[q]!]!;
    }
    const nothingAhead = ahead[i + 1] === 0;
    const next = new StateLayer(Math.max(64, layer.size));
    for (let s = 0; s < layer.size; s++) {
      const lo = layer.lo[s]!;
      const hi = layer.hi[s]!;
      const cost = layer.cost[s]!;
      for (let p = 0; p < pw; p++) {
        base[p] = p < PER_HALF ? (lo >>> (5 * p)) & 31 : (hi >>> (5 * (p - PER_HALF))) & 31;
      }
      for (let p = pw; p < w; p++) base[p] = 0;

      for (let k = 0; k < opts.length; k++) {
        const o = opts[k]!;
        for (let q = 0; q < w; q++) t[q] = base[q]!;
        const du = o.du;
        const dv = o.dv;
        if (du > 0) t[uPos] = t[uPos] === 0 ? (FRESH_U << 1) | (du & 1) : t[uPos]! ^ (du & 1);
        if (dv > 0) t[vPos] = t[vPos] === 0 ? (FRESH_V << 1) | (dv & 1) : t[vPos]! ^ (dv & 1);
        if (o.joins) {
          const cu = t[uPos]! >> 1;
          const cv = t[vPos]! >> 1;
          if (cu !== cv) for (let q = 0; q < w; q++) if (t[q]! >> 1 === cv) t[q] = (cu << 1) | (t[q]! & 1);
        }

        // Nodes whose last edge this is leave the front: untouched only if not required, touched
        // only with their final parity; a component leaving entirely must be the whole walk.
        let ok = true;
        let closed = false;
        for (let q = 0; q < w; q++) removed[q] = 0;
        for (let l = 0; l < leaving.length; l++) {
          const p = leaving[l]!;
          const code = t[p]!;
          removed[p] = 1;
          if (code === 0) {
            if (req[p]) ok = false;
          } else if ((code & 1) !== odd[p]) ok = false;
          else {
            const c = code >> 1;
            let alive = false;
            for (let q = 0; q < w && !alive; q++) if (!removed[q] && t[q]! >> 1 === c) alive = true;
            if (!alive) {
              closed = true;
              ok = nothingAhead;
              for (let q = 0; q < w && ok; q++) if (!removed[q] && (t[q] !== 0 || req[q])) ok = false;
            }
          }
          if (!ok || closed) break;
        }
        if (!ok) continue;
        const total = cost + o.costMm;
        if (closed) {
          if (total < bestCost) {
            bestCost = total;
            bestStep = i;
            bestParent = s;
            bestUse = o.use;
          }
          continue;
        }

        stamp++;
        let ids = 0;
        let nlo = 0;
        let nhi = 0;
        let r = 0;
        for (let q = 0; q < w; q++) {
          if (removed[q]) continue;
          let code = t[q]!;
          if (code !== 0) {
            const c = code >> 1;
            if (seen[c] !== stamp) {
              seen[c] = stamp;
              remap[c] = ++ids;
            }
            code = (remap[c]! << 1) | (code & 1);
          }
          if (r < PER_HALF) nlo |= code << (5 * r);
          else nhi |= code << (5 * (r - PER_HALF));
          r++;
        }
        next.offer(nlo, nhi, total, s, o.use);
      }
      if (next.size > maxStates) return { tooManyStates: true };
    }
    parents.push(next.parent.slice(0, next.size));
    usesAt.push(next.use.slice(0, next.size));
    layer = next;
    if (next.size === 0) break;
  }
  if (bestStep < 0) throw new Error("corridor sweep found no walk although every stop is reachable");

  const uses = new Uint8Array(inst.edges.length);
  uses[steps[bestStep]!.edge] = bestUse;
  let s = bestParent;
  for (let i = bestStep - 1; i >= 0; i--) {
    uses[steps[i]!.edge] = usesAt[i]![s]!;
    s = parents[i]![s]!;
  }
  return { costMm: bestCost, uses };
}
