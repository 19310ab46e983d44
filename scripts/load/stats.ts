// Counts and latencies per request kind, and the tables the load run prints and writes.
import { EXPECTED, KINDS, type Kind, type Verdict } from "./handheld";

const CONFIRMATION_KINDS: readonly Kind[] = ["confirm", "repeat", "wrong scan", "double tap"];

export type KindStats = { latencies: number[]; statuses: Map<number, number>; ok: number; bad: number };

export class PhaseStats {
  readonly kinds = new Map<Kind, KindStats>(
    KINDS.map((k) => [k, { latencies: [], statuses: new Map(), ok: 0, bad: 0 }]),
  );
  readonly problems: string[] = [];
  timeouts = 0;
  socketErrors = 0;
  seconds = 0;
  endedAt = Infinity;
  /** When each confirmation was answered (performance.now()) and how long it took. */
  readonly confirmationTimes: { at: number; ms: number }[] = [];

  record(kind: Kind, status: number, ms: number, verdict: Verdict) {
    if (CONFIRMATION_KINDS.includes(kind)) this.confirmationTimes.push({ at: performance.now(), ms });
    const k = this.kinds.get(kind)!;
    k.latencies.push(ms);
    k.statuses.set(status, (k.statuses.get(status) ?? 0) + 1);
    if (verdict.ok) k.ok++;
    else {
      k.bad++;
      if (this.problems.length < 20) this.problems.push(verdict.why ?? `${kind} answered ${status}`);
    }
  }

  /** Every POST to /api/batches/[id]/confirm together: the figure the p95 target is about. */
  confirmations(): KindStats {
    const all: KindStats = { latencies: [], statuses: new Map(), ok: 0, bad: 0 };
    for (const kind of CONFIRMATION_KINDS) {
      const k = this.kinds.get(kind)!;
      all.latencies.push(...k.latencies);
      for (const [s, n] of k.statuses) all.statuses.set(s, (all.statuses.get(s) ?? 0) + n);
      all.ok += k.ok;
      all.bad += k.bad;
    }
    return all;
  }

  /** Unexpected answers, timeouts and socket errors. Expected refusals are not errors. */
  errors(): number {
    let bad = 0;
    for (const k of this.kinds.values()) bad += k.bad;
    return bad + this.timeouts + this.socketErrors;
  }
}

/** Nearest-rank percentile of an ascending array. */
export function percentile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))]!;
}

export type Summary = {
  count: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  max: number;
  ok2xx: number;
  refused4xx: number;
  errors: number;
};

export function summarise(k: KindStats, seconds: number, expected4xx: boolean): Summary {
  const sorted = [...k.latencies].sort((a, b) => a - b);
  let ok2xx = 0;
  let refused4xx = 0;
  for (const [s, n] of k.statuses) {
    if (s >= 200 && s < 300) ok2xx += n;
    else if (s >= 400 && s < 500 && expected4xx) refused4xx += n;
  }
  return {
    count: sorted.length,
    perSecond: sorted.length / seconds,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    max: sorted.at(-1) ?? NaN,
    ok2xx,
    refused4xx,
    errors: k.bad,
  };
}

const ms = (x: number) => (Number.isNaN(x) ? "–" : x < 10 ? `${x.toFixed(1)} ms` : `${Math.round(x)} ms`);
const int = (x: number) => x.toLocaleString("en");

export const TABLE_HEAD = [
  "| requests | count | req/s | p50 | p95 | p99 | max | 2xx | expected 4xx | errors |",
  "|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|",
];

export function tableRow(label: string, s: Summary): string {
  return `| ${label} | ${int(s.count)} | ${s.perSecond.toFixed(1)} | ${ms(s.p50)} | ${ms(s.p95)} | ${ms(s.p99)} | ${ms(s.max)} | ${int(s.ok2xx)} | ${int(s.refused4xx)} | ${int(s.errors)} |`;
}

const LABELS: Record<Kind, string> = {
  confirm: "confirm, first send",
  repeat: "confirm, same key resent",
  "wrong scan": "confirm, wrong scan (422 expected)",
  "double tap": "confirm, new key on a done line (409 expected)",
  "pick view": "GET pick view",
  "my batches": "GET my batches",
};

/** The rows of one phase: all confirmations first (the target), then each kind that occurred. */
export function phaseRows(p: PhaseStats): string[] {
  const rows = [tableRow("**all confirmations**", summarise(p.confirmations(), p.seconds, true))];
  for (const kind of KINDS) {
    const k = p.kinds.get(kind)!;
    if (k.latencies.length) rows.push(tableRow(LABELS[kind], summarise(k, p.seconds, EXPECTED[kind] >= 400)));
  }
  return rows;
}

/** p50/p95/max of the confirmations answered between two moments (performance.now()). */
export function windowRow(label: string, p: PhaseStats, from: number, to: number): string {
  const inside = p.confirmationTimes.filter((c) => c.at >= from && c.at < to).map((c) => c.ms);
  const k: KindStats = { latencies: inside, statuses: new Map(), ok: 0, bad: 0 };
  const s = summarise(k, Math.max(0.001, (Math.min(to, p.endedAt) - from) / 1000), true);
  return `| ${label} | ${int(s.count)} | ${s.perSecond.toFixed(1)} | ${ms(s.p50)} | ${ms(s.p95)} | ${ms(s.p99)} | ${ms(s.max)} | | | |`;
}
