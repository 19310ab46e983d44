"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { postJson } from "@/lib/client/fetch-json";
import { newIdempotencyKey } from "@/lib/picking/key";
import {
  confirmationFor,
  enqueue,
  flushQueue,
  lineStatus,
  marksAfterAnswer,
  mergeQueued,
  outcomeOf,
  readQueue,
  refusalText,
  RETRY_MS,
  withMark,
  type LocalMarks,
  type PickAction,
} from "@/lib/picking/queue";

const store = () => (typeof window === "undefined" ? null : window.localStorage);

type Options = {
  batchId: number;
  batchVersion: number;
  /** Called after every sending run, so the screen reloads the server's view. */
  revalidate: () => Promise<unknown>;
  /** Called with what to tell the picker when the server refuses a queued confirmation. */
  onRefused: (text: string) => void;
};

/**
 * The handheld's offline queue: confirmations are kept on the device, sent in order, and sent again
 * on a timer, when the browser comes back online, or when the picker asks, until the server answers.
 */
export function usePickQueue({ batchId, batchVersion, revalidate, onRefused }: Options) {
  const [marks, setMarks] = useState<LocalMarks>({});
  const [waiting, setWaiting] = useState(0);
  const flushing = useRef(false);
  const again = useRef(false);
  // Through a ref, so that a new callback each render does not make a new `flush` and resend.
  const refused = useRef(onRefused);
  refused.current = onRefused;

  const flush = useCallback(async () => {
    const s = store();
    if (!s) return;
    if (flushing.current) {
      again.current = true;
      return;
    }
    flushing.current = true;
    try {
      await flushQueue(
        s,
        batchId,
        async (c) => {
          const r = await postJson<unknown>(`/api/batches/${batchId}/confirm`, c);
          return { status: r.status, body: r.ok ? r.data : r.body };
        },
        (c, r) => {
          const outcome = outcomeOf(r.status);
          setMarks((m) => marksAfterAnswer(m, c, outcome));
          if (outcome === "refused") refused.current(refusalText(r));
        },
      );
    } finally {
      flushing.current = false;
      setWaiting(readQueue(s, batchId).length);
      await revalidate();
    }
    if (again.current) {
      again.current = false;
      if (readQueue(s, batchId).length) setTimeout(() => void flushRef.current(), 0);
    }
  }, [batchId, revalidate]);
  const flushRef = useRef(flush);
  flushRef.current = flush;

  useEffect(() => {
    const s = store();
    if (s) {
      // Confirmations queued before a reload still count on this screen.
      const queued = readQueue(s, batchId);
      setWaiting(queued.length);
      setMarks((m) => mergeQueued(m, queued));
    }
    void flush();
    const online = () => void flush();
    window.addEventListener("online", online);
    return () => window.removeEventListener("online", online);
  }, [batchId, flush]);

  // A 503 or a dropped connection leaves picks queued, and the picker may have nothing left to tap
  // that would send them; so while any wait, try again on a timer until the server takes them.
  useEffect(() => {
    if (waiting === 0) return;
    const timer = setInterval(() => void flushRef.current(), RETRY_MS);
    return () => clearInterval(timer);
  }, [waiting]);

  /** Marks the line at once and queues its confirmation, made with what the screen showed. */
  function record(action: PickAction, binCode: string) {
    const s = store();
    const c = confirmationFor(action, { binCode, batchVersion }, newIdempotencyKey());
    setMarks((m) => withMark(m, action));
    if (s) setWaiting(enqueue(s, batchId, c).length);
    void flush();
  }

  const statusOf = useCallback(
    <S extends string>(orderLineId: number, serverStatus: S) => lineStatus(marks, orderLineId, serverStatus),
    [marks],
  );

  return { waiting, statusOf, record, flush };
}
