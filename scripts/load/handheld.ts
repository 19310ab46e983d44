// One handheld's behaviour during the load run: walk its batches line by line, load each batch's pick
// view before its first stop, and now and then do what real handhelds do: resend a confirmation whose
// answer got lost (same idempotency key), scan the wrong bin (refused, nothing stored), tap confirm
// again on a line already done with a new key (refused as already confirmed). Every confirmation key
// and every answer to it goes into the ledger that the check afterwards compares with the database.
import { randomUUID } from "node:crypto";
import type { HandheldAccount, PickLine } from "./setup";

export const KINDS = ["confirm", "repeat", "wrong scan", "double tap", "pick view", "my batches"] as const;
export type Kind = (typeof KINDS)[number];

/** What a correct server answers to each kind; anything else is an error of the run. */
export const EXPECTED: Record<Kind, number> = {
  confirm: 200,
  repeat: 200,
  "wrong scan": 422,
  "double tap": 409,
  "pick view": 200,
  "my batches": 200,
};

export type Mix = { repeat: number; doubleTap: number; wrongScan: number; short: number };
/** Shares per confirmation: lost answers resent, second taps, wrong scans, short picks. */
export const DEFAULT_MIX: Mix = { repeat: 0.05, doubleTap: 0.01, wrongScan: 0.03, short: 0.03 };

export type KeyRecord = {
  key: string;
  batchId: number;
  orderLineId: number;
  userId: string;
  quantity: number;
  short: boolean;
  kind: "confirm" | "wrong scan" | "double tap";
  statuses: number[];
};
export type Ledger = Map<string, KeyRecord>;

export type Shot = {
  kind: Kind;
  method: "GET" | "POST";
  path: string;
  body?: string;
  key?: string;
  line?: PickLine;
  firstAnswer?: string;
};
export type Verdict = { ok: boolean; why?: string };

const WRONG_SCAN = "NO-SUCH-BIN";
const MAX_TRIES = 3;

export class Handheld {
  private batch = 0;
  private line = 0;
  private readonly viewed = new Set<number>();
  private readonly wrongScanned = new Set<number>();
  /** Sent and not answered (a timeout, a dropped connection, the end of the run): sent again as it was. */
  inFlight: Shot | null = null;
  private again: Shot | null = null;
  private tries = 0;
  private lastAck: { shot: Shot; answer: string } | null = null;
  resent = 0;

  constructor(
    readonly account: HandheldAccount,
    private readonly rand: () => number,
    private readonly mix: Mix,
    private readonly ledger: Ledger,
  ) {}

  private current(): PickLine | null {
    while (this.batch < this.account.batches.length) {
      const l = this.account.batches[this.batch]!.lines[this.line];
      if (l) return l;
      this.batch++;
      this.line = 0;
    }
    return null;
  }

  private advance() {
    this.line++;
    this.tries = 0;
    this.again = null;
  }

  /** Lines this handheld has not confirmed yet. */
  openLines(): number {
    let n = 0;
    for (let b = this.batch; b < this.account.batches.length; b++)
      n += this.account.batches[b]!.lines.length - (b === this.batch ? this.line : 0);
    return n;
  }

  private confirmation(kind: KeyRecord["kind"], line: PickLine, scan: string, quantity: number, short: boolean): Shot {
    const key = randomUUID();
    const body = {
      idempotencyKey: key,
      orderLineId: line.orderLineId,
      binCode: line.binCode,
      batchVersion: line.batchVersion,
      scan,
      quantity,
      ...(short ? { short: { reason: "empty bin" } } : {}),
    };
    this.ledger.set(key, {
      key,
      batchId: line.batchId,
      orderLineId: line.orderLineId,
      userId: this.account.userId,
      quantity,
      short,
      kind,
      statuses: [],
    });
    return {
      kind,
      method: "POST",
      path: `/api/batches/${line.batchId}/confirm`,
      body: JSON.stringify(body),
      key,
      line,
    };
  }

  /** The next request this handheld sends. */
  next(): Shot {
    if (this.inFlight) {
      this.resent++;
      return this.inFlight;
    }
    this.inFlight = this.choose();
    return this.inFlight;
  }

  private choose(): Shot {
    if (this.again) return this.again;
    const ack = this.lastAck;
    this.lastAck = null;
    if (ack) {
      const r = this.rand();
      if (r < this.mix.repeat) return { ...ack.shot, kind: "repeat", firstAnswer: ack.answer };
      if (r < this.mix.repeat + this.mix.doubleTap)
        return this.confirmation("double tap", ack.shot.line!, ack.shot.line!.binCode, ack.shot.line!.quantity, false);
    }
    const line = this.current();
    if (!line) return { kind: "my batches", method: "GET", path: "/api/my-batches" };
    if (!this.viewed.has(line.batchId))
      return { kind: "pick view", method: "GET", path: `/api/batches/${line.batchId}/pick`, line };
    if (!this.wrongScanned.has(line.orderLineId) && this.rand() < this.mix.wrongScan) {
      this.wrongScanned.add(line.orderLineId);
      return this.confirmation("wrong scan", line, WRONG_SCAN, line.quantity, false);
    }
    const short = this.rand() < this.mix.short;
    // Scanners read either label: the bin's or the item's.
    const scan = this.rand() < 0.5 ? line.binCode : line.sku;
    return this.confirmation("confirm", line, scan, short ? line.quantity - 1 : line.quantity, short);
  }

  /** Takes the answer to the request in flight and says whether it was the right one. */
  answered(shot: Shot, status: number, body: string, headers: Record<string, unknown>): Verdict {
    if (this.inFlight === shot) this.inFlight = null;
    if (shot.key) this.ledger.get(shot.key)?.statuses.push(status);
    const expected = EXPECTED[shot.kind];
    switch (shot.kind) {
      case "confirm":
        if (status === expected) {
          this.lastAck = { shot, answer: body };
          this.advance();
          return { ok: true };
        }
        // The handheld's offline queue sends the same key again; after a few tries the picker moves on.
        this.again = shot;
        if (++this.tries >= MAX_TRIES) this.advance();
        return { ok: false, why: `confirm answered ${status}: ${body.slice(0, 200)}` };
      case "repeat": {
        if (status !== expected) return { ok: false, why: `repeat answered ${status}: ${body.slice(0, 200)}` };
        if (headers["idempotent-replayed"] !== "true")
          return { ok: false, why: "repeat not marked idempotent-replayed" };
        if (body !== shot.firstAnswer)
          return {
            ok: false,
            why: `repeat answer differs from the first: ${body.slice(0, 200)} vs ${shot.firstAnswer?.slice(0, 200)}`,
          };
        return { ok: true };
      }
      case "pick view":
        if (status === expected) this.viewed.add(shot.line!.batchId);
        break;
    }
    return status === expected
      ? { ok: true }
      : { ok: false, why: `${shot.kind} answered ${status}: ${body.slice(0, 200)}` };
  }
}
