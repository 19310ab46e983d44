// The device's queue of confirmations not yet answered by the server, one list per batch in
// localStorage: on flaky Wi-Fi a pick is queued and sent, in order, when the connection is back.
// The transitions are pure functions of the list (and of the screen's marks), so that the hook in
// components/picking/usePickQueue.ts only wires them to storage, timers and fetch.

export type QueuedConfirmation = {
  idempotencyKey: string;
  orderLineId: number;
  scan?: string;
  quantity: number;
  short?: { reason: string };
  /** What the screen showed when the picker confirmed: the server refuses the pick if either no longer holds. */
  binCode: string;
  batchVersion: number;
};

/** What the picker did, before the device gives it a key and what the screen showed. */
export type PickAction = Omit<QueuedConfirmation, "idempotencyKey" | "binCode" | "batchVersion">;

export interface KeyValueStore {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

export type SendResult = { status: number; body: unknown };

/** While anything waits, the device tries again this often, even if the picker taps nothing. */
export const RETRY_MS = 5000;

/** A line as this device has it before the server's view catches up. */
export type LocalMark = { status: "picked" | "short"; pickedQty: number; shortReason: string | null };
export type LocalMarks = Record<number, LocalMark>;

// ---- the list

/** Adds a confirmation at the end; the same key twice stays one entry, where it was first queued. */
export function withEntry(q: readonly QueuedConfirmation[], c: QueuedConfirmation): QueuedConfirmation[] {
  return q.some((x) => x.idempotencyKey === c.idempotencyKey) ? [...q] : [...q, c];
}

export function withoutEntry(q: readonly QueuedConfirmation[], key: string): QueuedConfirmation[] {
  return q.filter((x) => x.idempotencyKey !== key);
}

/** The oldest confirmation: the queue goes out in the order the picker made them. */
export function nextToSend(q: readonly QueuedConfirmation[]): QueuedConfirmation | null {
  return q[0] ?? null;
}

/**
 * What an answer means for its entry. No answer (status 0, a network failure) or a 5xx may not have been
 * stored, so the entry stays for the next try; 409 "already confirmed" means the line is done either way;
 * any other status is a refusal that will not change by sending again.
 */
export type Outcome = "undelivered" | "accepted" | "already" | "refused";

export function outcomeOf(status: number): Outcome {
  if (status === 0 || status >= 500) return "undelivered";
  if (status === 200) return "accepted";
  if (status === 409) return "already";
  return "refused";
}

/** The list after the server's answer to entry `key`. */
export function afterAnswer(q: readonly QueuedConfirmation[], key: string, outcome: Outcome): QueuedConfirmation[] {
  return outcome === "undelivered" ? [...q] : withoutEntry(q, key);
}

/** The confirmation the device sends for an action: one key per action, so every resend carries it. */
export function confirmationFor(
  action: PickAction,
  shown: { binCode: string; batchVersion: number },
  idempotencyKey: string,
): QueuedConfirmation {
  return { idempotencyKey, ...action, binCode: shown.binCode, batchVersion: shown.batchVersion };
}

// ---- what the screen shows

export function markOf(c: PickAction): LocalMark {
  return { status: c.short ? "short" : "picked", pickedQty: c.quantity, shortReason: c.short?.reason ?? null };
}

export function withMark(marks: LocalMarks, c: PickAction): LocalMarks {
  return { ...marks, [c.orderLineId]: markOf(c) };
}

/** A refusal undoes the tick; every other answer leaves the line as the picker marked it. */
export function marksAfterAnswer(marks: LocalMarks, c: PickAction, outcome: Outcome): LocalMarks {
  if (outcome !== "refused") return marks;
  const { [c.orderLineId]: _gone, ...rest } = marks;
  return rest;
}

/** After a reload, confirmations still queued count on the screen; a mark made since wins. */
export function mergeQueued(marks: LocalMarks, queued: readonly QueuedConfirmation[]): LocalMarks {
  return { ...Object.fromEntries(queued.map((c) => [c.orderLineId, markOf(c)])), ...marks };
}

/** A line's state on this device: its local mark if any, else what the server said. */
export function lineStatus<S extends string>(
  marks: LocalMarks,
  orderLineId: number,
  serverStatus: S,
): S | LocalMark["status"] {
  return marks[orderLineId]?.status ?? serverStatus;
}

export function refusalText(r: SendResult): string {
  return (r.body as { error?: string } | null)?.error ?? `The server refused a confirmation (${r.status}).`;
}

// ---- the list in storage

const keyOf = (batchId: number) => `trailbin.pick-queue.${batchId}`;

export function readQueue(store: KeyValueStore, batchId: number): QueuedConfirmation[] {
  try {
    const v = JSON.parse(store.getItem(keyOf(batchId)) ?? "[]");
    return Array.isArray(v) ? (v as QueuedConfirmation[]) : [];
  } catch {
    return [];
  }
}

function writeQueue(store: KeyValueStore, batchId: number, q: QueuedConfirmation[]): QueuedConfirmation[] {
  if (q.length) store.setItem(keyOf(batchId), JSON.stringify(q));
  else store.removeItem(keyOf(batchId));
  return q;
}

export function enqueue(store: KeyValueStore, batchId: number, c: QueuedConfirmation): QueuedConfirmation[] {
  return writeQueue(store, batchId, withEntry(readQueue(store, batchId), c));
}

export function dropFromQueue(store: KeyValueStore, batchId: number, key: string): QueuedConfirmation[] {
  return writeQueue(store, batchId, withoutEntry(readQueue(store, batchId), key));
}

/**
 * Sends the queue in order. A confirmation the server answered leaves the queue; the first that could
 * not be delivered stops the run so the order is kept for the next try.
 */
export async function flushQueue(
  store: KeyValueStore,
  batchId: number,
  send: (c: QueuedConfirmation) => Promise<SendResult>,
  onAnswer?: (c: QueuedConfirmation, r: SendResult) => void,
): Promise<{ sent: number; left: number }> {
  let sent = 0;
  // The head each time, so confirmations queued while this runs go out in the same run.
  for (let c = nextToSend(readQueue(store, batchId)); c; c = nextToSend(readQueue(store, batchId))) {
    const r = await send(c);
    const outcome = outcomeOf(r.status);
    if (outcome === "undelivered") break;
    writeQueue(store, batchId, afterAnswer(readQueue(store, batchId), c.idempotencyKey, outcome));
    sent++;
    onAnswer?.(c, r);
  }
  return { sent, left: readQueue(store, batchId).length };
}
