"use client";

import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import Link from "next/link";
import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import { ProgressBar } from "@/components/ProgressBar";
import { FloorPlanView } from "@/components/floor/FloorPlanView";
import type { EditorDocument } from "@/lib/floor-plan/document";
import type { PickLineState } from "@/lib/contracts/picking";
import type { PickViewDTO } from "@/lib/contracts/picking";
import {
  CAUTION_TEXT,
  lineForScan,
  SHORT_REASONS,
  tapHoldMs,
  walkingOrder,
  type ShortReason,
} from "@/lib/picking/rules";
import type { PickAction } from "@/lib/picking/queue";
import { usePickQueue } from "@/components/picking/usePickQueue";

/** How often the handheld asks whether its batch is still its own. */
const PICK_POLL_MS = 5000;

type Feedback = { kind: "wrong" | "ok" | "error"; text: string } | null;

/** The handheld: one stop at a time, confirmed by a scan or a tap, queued on the device when offline. */
export function PickScreen({ initial, document: doc }: { initial: PickViewDTO; document: EditorDocument | null }) {
  const url = `/api/batches/${initial.batch.id}/pick`;
  // Set when the server says this batch is no longer the picker's (a supervisor moved it or took it back).
  const [gone, setGone] = useState<string | null>(null);
  const { data, error, mutate } = useSWR<PickViewDTO>(url, swrFetcher, {
    fallbackData: initial,
    revalidateOnFocus: false,
    // Polling, so a batch moved to someone else says so at once instead of at the next tap.
    refreshInterval: gone ? 0 : PICK_POLL_MS,
  });
  useEffect(() => {
    const status = (error as { status?: number } | undefined)?.status;
    if (error && (status === 403 || status === 404)) setGone(error.message);
  }, [error]);
  const view = data ?? initial;
  const batchId = view.batch.id;
  const [skipped, setSkipped] = useState<number[]>([]);
  const [feedback, setFeedback] = useState<Feedback>(null);
  const [scan, setScan] = useState("");
  const [shortOpen, setShortOpen] = useState(false);
  const [shortQty, setShortQty] = useState(0);
  const [shortReason, setShortReason] = useState<ShortReason>("empty bin");
  const scanRef = useRef<HTMLInputElement>(null);
  // The line the tap button confirms, set only once that line has been on screen for a moment.
  const [armed, setArmed] = useState<number | null>(null);
  const armedRef = useRef<number | null>(null);
  const lastBin = useRef<string | null>(null);
  const {
    waiting,
    statusOf,
    record: queueRecord,
    flush,
  } = usePickQueue({
    batchId,
    batchVersion: view.batch.version,
    revalidate: mutate,
    onRefused: (text) => setFeedback({ kind: "error", text }),
  });

  const stateOf = useCallback((l: PickLineState) => statusOf(l.orderLineId, l.pickStatus), [statusOf]);
  const order = useMemo(
    () =>
      walkingOrder(
        view.stops.map((s) => s.seq),
        skipped,
      ),
    [view.stops, skipped],
  );
  const openStops = order
    .map((seq) => view.stops.find((s) => s.seq === seq)!)
    .filter((s) => s.lines.some((l) => stateOf(l) === "open"));
  const stop = openStops[0] ?? null;
  const nextStop = openStops[1] ?? null;
  const line = stop?.lines.find((l) => stateOf(l) === "open") ?? null;
  const doneStops = view.stops.length - openStops.length;
  const openLines = view.stops.reduce((n, s) => n + s.lines.filter((l) => stateOf(l) === "open").length, 0);

  const focusScan = () => setTimeout(() => scanRef.current?.focus(), 0);

  const shownId = line?.orderLineId ?? null;
  const shownBin = line?.binCode ?? null;
  useEffect(() => {
    armedRef.current = null;
    setArmed(null);
    if (shownId === null || shownBin === null) return;
    const timer = setTimeout(
      () => {
        armedRef.current = shownId;
        setArmed(shownId);
      },
      tapHoldMs(lastBin.current, shownBin),
    );
    return () => clearTimeout(timer);
  }, [shownId, shownBin]);

  useEffect(() => {
    scanRef.current?.focus();
  }, [batchId]);

  function record(l: PickLineState, c: PickAction) {
    armedRef.current = null;
    setArmed(null);
    lastBin.current = l.binCode;
    queueRecord(c, l.binCode);
    focusScan();
  }

  function onScan(e: React.FormEvent) {
    e.preventDefault();
    if (!line) return;
    const value = scan.trim();
    setScan("");
    if (!value) return;
    const open = stop?.lines.filter((l) => stateOf(l) === "open") ?? [];
    const target = lineForScan(value, line, open);
    if (!target) {
      navigator.vibrate?.(200);
      const bins = [...new Set(open.map((l) => l.binCode))];
      const where = bins.length > 1 ? `bins ${bins.join(", ")}` : `bin ${line.binCode} (SKU ${line.sku})`;
      setFeedback({ kind: "wrong", text: `Wrong scan. That is ${value}; this stop is ${where}. Scan again.` });
      focusScan();
      return;
    }
    setFeedback({
      kind: "ok",
      text: `${target.quantity} ${target.uom} ${target.sku} from bin ${target.binCode} into tote ${target.tote}: picked.`,
    });
    record(target, { orderLineId: target.orderLineId, scan: value, quantity: target.quantity });
  }

  function onTap() {
    // A second tap of a double tap finds the button disarmed, whatever line is on screen by then.
    if (!line || armedRef.current !== line.orderLineId) return;
    setFeedback({ kind: "ok", text: `${line.quantity} ${line.uom} ${line.sku} into tote ${line.tote}: picked.` });
    record(line, { orderLineId: line.orderLineId, quantity: line.quantity });
  }

  function onShort(e: React.FormEvent) {
    e.preventDefault();
    if (!line) return;
    const qty = Math.max(0, Math.min(line.quantity - 1, Math.floor(shortQty)));
    setShortOpen(false);
    setFeedback({
      kind: "ok",
      text: `Short pick recorded: ${qty} of ${line.quantity} ${line.uom} ${line.sku} (${shortReason}).`,
    });
    record(line, { orderLineId: line.orderLineId, quantity: qty, short: { reason: shortReason } });
  }

  function onSkip() {
    if (!stop) return;
    setSkipped((s) => [...s.filter((x) => x !== stop.seq), stop.seq]);
    setFeedback({ kind: "ok", text: `Stop at ${stop.binCodes.join(", ")} skipped: it comes again after the others.` });
    setShortOpen(false);
    focusScan();
  }

  const waitingNote = waiting > 0 && (
    <p
      className="notice-info flex flex-wrap items-center justify-between gap-2"
      role="status"
      data-testid="queue-waiting"
    >
      <span>
        {waiting} confirmation{waiting === 1 ? "" : "s"} waiting to send; {waiting === 1 ? "it goes" : "they go"} out by{" "}
        {waiting === 1 ? "itself" : "themselves"} when the server answers again
      </span>
      <button type="button" className="btn-quiet" onClick={() => void flush()}>
        Send now
      </button>
    </p>
  );

  const progress = (
    <div>
      <p className="flex justify-between text-sm font-semibold">
        <span data-testid="stop-progress">
          {stop
            ? `Stop ${doneStops + 1} of ${view.stops.length}`
            : `${view.stops.length} of ${view.stops.length} stops`}
        </span>
        <span className="text-ink-soft">
          Batch {view.batch.number} · {view.batch.waveName}
        </span>
      </p>
      <ProgressBar className="mt-1" label="Stops done" value={doneStops} max={view.stops.length} />
    </div>
  );

  if (gone) {
    return (
      <div className="mx-auto max-w-md space-y-4">
        <h1>Batch {view.batch.number}</h1>
        <p className="notice-error text-lg font-semibold" role="alert" data-testid="batch-gone">
          {gone}
        </p>
        <p>Leave the cart and its totes as they are, and tell your supervisor where the cart stands.</p>
        <Link className="btn-primary w-full" href="/my-batches">
          Back to my batches
        </Link>
      </div>
    );
  }

  if (!stop || !line) {
    const shorts = view.stops.flatMap((s) => s.lines).filter((l) => stateOf(l) === "short").length;
    return (
      <div className="mx-auto max-w-md space-y-4" data-testid="batch-done" data-open-lines={0}>
        {progress}
        <h1>Batch {view.batch.number} done</h1>
        <p className="notice-info text-lg font-semibold">Take the cart to {view.dropoff}.</p>
        {shorts > 0 && (
          <p>
            {shorts} short pick{shorts === 1 ? "" : "s"} recorded: the planner sees {shorts === 1 ? "it" : "them"}.
          </p>
        )}
        {waitingNote}
        {doc && (
          <FloorPlanView
            document={doc}
            route={{ cells: view.finalLeg.cells, stops: [] }}
            label={`Path to ${view.dropoff}`}
          />
        )}
        <Link className="btn-primary w-full" href="/my-batches">
          Back to my batches
        </Link>
      </div>
    );
  }

  const planned = view.stops.findIndex((s) => s.seq === stop.seq);
  const from = planned === 0 ? view.depot : `stop ${view.stops[planned - 1]?.seq}`;

  return (
    <div className="mx-auto max-w-md space-y-4" data-open-lines={openLines}>
      {progress}
      {waitingNote}
      <section aria-label="This stop" className="card space-y-3 p-4">
        <p className="text-sm text-ink-soft">Go to</p>
        <p className="font-mono text-3xl font-bold tracking-wide" data-testid="stop-location">
          {line.binCode}
        </p>
        {stop.binCodes.length > 1 && (
          <p className="font-semibold" data-testid="stop-bins">
            This stop has {stop.binCodes.length} bins:{" "}
            {stop.binCodes.map((code, i) => (
              <span key={code} className="whitespace-nowrap font-mono">
                {code}
                {i < stop.binCodes.length - 1 ? ", " : ""}
              </span>
            ))}
            . Each line says its bin.
          </p>
        )}
        <ul className="space-y-2">
          {stop.lines.map((l) => {
            const st = stateOf(l);
            return (
              <li
                key={l.orderLineId}
                className={`rounded-md border-2 p-3 ${l === line ? "border-trail" : "border-rack-light"}`}
                data-testid="stop-line"
              >
                <p className="font-mono text-lg font-semibold" data-testid="line-bin">
                  Bin {l.binCode}
                </p>
                <p className="text-xl font-bold">
                  {l.quantity} {l.uom} · {l.sku}
                </p>
                <p>{l.description}</p>
                <p className="text-lg">
                  Into tote <span className="font-bold">{l.tote}</span>{" "}
                  <span className="text-sm text-ink-soft">({l.orderNumber})</span>
                </p>
                {st !== "open" && <p className="font-semibold">✓ {st === "short" ? "short" : "picked"}</p>}
              </li>
            );
          })}
        </ul>
        {stop.cautions.map((c) => (
          <p key={c} className="notice-info font-semibold" data-testid="caution">
            ⚠ {CAUTION_TEXT[c]}
          </p>
        ))}
      </section>

      {feedback && (
        <p
          role={feedback.kind === "ok" ? "status" : "alert"}
          data-testid={feedback.kind === "wrong" ? "wrong-scan" : "feedback"}
          className={feedback.kind === "ok" ? "notice-info" : "notice-error font-semibold"}
        >
          {feedback.kind === "ok" ? "✓ " : "✕ "}
          {feedback.text}
        </p>
      )}

      <form onSubmit={onScan} className="space-y-2">
        <label className="label" htmlFor="scan">
          Scan the bin or the SKU
        </label>
        <input
          id="scan"
          ref={scanRef}
          className="field font-mono text-xl"
          autoFocus
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          enterKeyHint="done"
          value={scan}
          onChange={(e) => setScan(e.target.value)}
        />
      </form>
      <button
        type="button"
        className="btn-primary min-h-16 w-full text-xl"
        onClick={onTap}
        disabled={armed !== line.orderLineId}
        data-line-id={line.orderLineId}
      >
        Picked {line.quantity} {line.uom} from {line.binCode}
      </button>
      <div className="grid grid-cols-2 gap-2">
        <button
          type="button"
          className="btn-danger"
          aria-expanded={shortOpen}
          onClick={() => {
            setShortOpen((o) => !o);
            setShortQty(0);
          }}
        >
          Short pick
        </button>
        <button type="button" className="btn-quiet" onClick={onSkip} disabled={openStops.length < 2}>
          Skip, come back later
        </button>
      </div>
      {shortOpen && (
        <form onSubmit={onShort} className="card space-y-3 p-4" aria-label="Short pick">
          <div>
            <label className="label" htmlFor="short-qty">
              Quantity found (0 to {line.quantity - 1})
            </label>
            <input
              id="short-qty"
              className="field"
              type="number"
              inputMode="numeric"
              min={0}
              max={line.quantity - 1}
              value={shortQty}
              onChange={(e) => setShortQty(Number(e.target.value))}
            />
          </div>
          <div>
            <label className="label" htmlFor="short-reason">
              Reason
            </label>
            <select
              id="short-reason"
              className="field"
              value={shortReason}
              onChange={(e) => setShortReason(e.target.value as ShortReason)}
            >
              {SHORT_REASONS.map((r) => (
                <option key={r} value={r}>
                  {r}
                </option>
              ))}
            </select>
          </div>
          <button type="submit" className="btn-danger w-full">
            Record short pick
          </button>
        </form>
      )}

      {doc && (
        <section aria-label="Map" className="card p-2">
          <FloorPlanView
            document={doc}
            route={{ cells: stop.pathCells, stops: [{ x: stop.x, y: stop.y, label: String(stop.seq) }] }}
            label={`Path from ${from} to this stop`}
          />
          <p className="mt-1 px-2 text-sm text-ink-soft">Path from {from} to this stop.</p>
        </section>
      )}
      {nextStop ? (
        <p className="text-ink-soft" data-testid="next-stop">
          Next: <span className="font-mono font-semibold">{nextStop.binCodes.join(", ")}</span> —{" "}
          {nextStop.lines.map((l) => `${l.quantity} ${l.uom} ${l.sku}`).join(", ")}
        </p>
      ) : (
        <p className="text-ink-soft">Last stop: then to {view.dropoff}.</p>
      )}
    </div>
  );
}
