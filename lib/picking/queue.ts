// The device's queue of confirmations not yet answered by the server, one list per batch in
// localStorage: on flaky Wi-Fi a pick is queued and sent, in order, when the connection is back.

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

export interface KeyValueStore {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
  removeItem(key: string): void;
}

const keyOf = (batchId: number) => `trailbin.pick-queue.${batchId}`;

export function readQueue(store: KeyValueStore, batchId: number): QueuedConfirmation[] {
  try {
    const v = JSON.parse(store.getItem(keyOf(batchId)) ?? "[]");
    return Array.isArray(v) ? (v as QueuedConfirmation[]) : [];
  } catch {
    return [];
  }
}

function writeQueue(store: KeyValueStore, batchId: number, q: QueuedConfirmation[]) {
  if (q.length) store.setItem(keyOf(batchId), JSON.stringify(q));
  else store.removeItem(keyOf(batchId));
}

/** Adds a confirmation; the same key twice stays one entry. */
export function enqueue(store: KeyValueStore, batchId: number, c: QueuedConfirmation): QueuedConfirmation[] {
  const q = readQueue(store, batchId);
  if (!q.some((x) => x.idempotencyKey === c.idempotencyKey)) q.push(c);
  writeQueue(store, batchId, q);
  return q;
}

export function dropFromQueue(store: KeyValueStore, batchId: number, key: string): QueuedConfirmation[] {
  const q = readQueue(store, batchId).filter((x) => x.idempotencyKey !== key);
  writeQueue(store, batchId, q);
  return q;
}

export type SendResult = { status: number; body: unknown };

/**
 * Sends the queue in order. A confirmation the server answered (any status but 0, a network failure,
 * or a 5xx, which may not have been stored) leaves the queue; the first that could not be delivered
 * stops the run so the order is kept for the next try.
 */
export async function flushQueue(
  store: KeyValueStore,
  batchId: number,
  send: (c: QueuedConfirmation) => Promise<SendResult>,
  onAnswer?: (c: QueuedConfirmation, r: SendResult) => void,
): Promise<{ sent: number; left: number }> {
  let sent = 0;
  // The head each time, so confirmations queued while this runs go out in the same run.
  for (let c = readQueue(store, batchId)[0]; c; c = readQueue(store, batchId)[0]) {
    const r = await send(c);
    if (r.status === 0 || r.status >= 500) return { sent, left: readQueue(store, batchId).length };
    dropFromQueue(store, batchId, c.idempotencyKey);
    sent++;
    onAnswer?.(c, r);
  }
  return { sent, left: readQueue(store, batchId).length };
}
