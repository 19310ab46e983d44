"use client";

import { useMemo, useState } from "react";
import useSWR from "swr";
import { swrFetcher } from "@/lib/client/fetch-json";
import { DataTable, type DataColumn } from "@/components/DataTable";
import { ProgressBar } from "@/components/ProgressBar";
import { useDateStyle } from "@/components/SiteFormat";
import { formatTimeWithSeconds, formatWhen } from "@/lib/format/dates";
import { minutes } from "@/lib/format/units";
import { timingNote } from "@/lib/batching/estimate";
import { FLOOR_STATUSES, type FloorBatchDTO, type FloorDTO, type FloorStatus } from "@/lib/contracts/shift";
import { AssignPanel } from "./AssignPanel";

/** How often the floor asks the server again: pickers confirm a line every few seconds. */
const FLOOR_POLL_MS = 4000;

const STATUS_LABEL: Record<FloorStatus, string> = {
  waiting: "Waiting for a picker",
  taken: "Taken, not started",
  "in progress": "Being picked",
  done: "Done",
};

/** The supervisor's live view: who holds which batch, how far along, how late, and who has nothing to do. */
export function ShiftFloor({ initial, canAssign }: { initial: FloorDTO; canAssign: boolean }) {
  const style = useDateStyle();
  const { data, error, mutate } = useSWR<FloorDTO>("/api/floor", swrFetcher, {
    fallbackData: initial,
    refreshInterval: FLOOR_POLL_MS,
  });
  const floor = data ?? initial;
  const [wave, setWave] = useState<string>("all");
  const [status, setStatus] = useState<FloorStatus | "all" | "late">("all");
  // The row as it was when the supervisor chose it: its version goes with the change, so anything
  // that happened since (a picker took it, another supervisor moved it) is refused, not overwritten.
  const [chosen, setChosen] = useState<FloorBatchDTO | null>(null);

  const waves = useMemo(() => {
    const seen = new Map<number, string>();
    for (const b of floor.batches) seen.set(b.waveId, b.waveName);
    return [...seen.entries()];
  }, [floor.batches]);
  // The counts follow the wave chosen; the table follows the wave and the status.
  const ofWave = floor.batches.filter((b) => wave === "all" || String(b.waveId) === wave);
  const shown = ofWave.filter(
    (b) => status === "all" || (status === "late" ? b.late && b.floorStatus !== "done" : b.floorStatus === status),
  );
  const count = (s: FloorStatus) => ofWave.filter((b) => b.floorStatus === s).length;
  const lateNow = ofWave.filter((b) => b.late && b.floorStatus !== "done").length;
  const idle = floor.pickers.filter((p) => p.onShift && p.openBatches === 0);

  const columns = useMemo<DataColumn<FloorBatchDTO>[]>(
    () => [
      {
        id: "batch",
        header: "Batch",
        accessorFn: (b) => `${b.waveName} #${b.number}`,
        cell: ({ row }) => (
          <span>
            <span className="font-semibold">#{row.original.number}</span>
            <span className="block text-sm text-ink-soft">{row.original.waveName}</span>
          </span>
        ),
      },
      {
        id: "picker",
        header: "Picker",
        accessorFn: (b) => b.pickerName ?? "",
        cell: ({ row }) => {
          const b = row.original;
          const h = b.lastHandover;
          return (
            <span>
              {b.pickerName ? (
                <span data-testid="floor-picker">{b.pickerName}</span>
              ) : (
                <span className="text-ink-soft">nobody</span>
              )}
              {h && (
                <span className="block text-sm text-ink-soft">
                  {h.kind === "taken-back" ? "taken back" : h.kind} by {h.byName ?? "someone"} {formatWhen(h.at, style)}
                </span>
              )}
            </span>
          );
        },
      },
      {
        id: "status",
        header: "Status",
        accessorFn: (b) => FLOOR_STATUSES.indexOf(b.floorStatus),
        cell: ({ row }) => (
          <span className="block min-w-32" data-testid="floor-status">
            {STATUS_LABEL[row.original.floorStatus]}
            {row.original.late && (
              <span className="block font-semibold text-alarm">
                ⚠ {row.original.floorStatus === "done" ? "took longer than estimated" : "over its estimate"}
              </span>
            )}
          </span>
        ),
      },
      {
        id: "taken",
        header: "Taken",
        accessorFn: (b) => b.takenAt ?? "",
        cell: ({ row }) => (row.original.takenAt ? formatWhen(row.original.takenAt, style) : "—"),
      },
      {
        id: "started",
        header: "Started",
        accessorFn: (b) => b.startedAt ?? "",
        cell: ({ row }) => (row.original.startedAt ? formatWhen(row.original.startedAt, style) : "—"),
      },
      {
        id: "finished",
        header: "Finished",
        accessorFn: (b) => b.finishedAt ?? "",
        cell: ({ row }) => (row.original.finishedAt ? formatWhen(row.original.finishedAt, style) : "—"),
      },
      {
        id: "lines",
        header: "Lines done",
        accessorFn: (b) => (b.lineCount ? b.doneLines / b.lineCount : 0),
        cell: ({ row }) => {
          const b = row.original;
          return (
            <span className="block min-w-28" data-testid="floor-lines">
              {b.doneLines} of {b.lineCount}
              {b.shortLines > 0 && <span className="text-alarm"> · {b.shortLines} short</span>}
              <ProgressBar
                className="mt-1"
                label={`Batch ${b.number} lines done`}
                value={b.doneLines}
                max={b.lineCount}
              />
            </span>
          );
        },
      },
      {
        id: "time",
        header: "Estimate / actual",
        accessorFn: (b) => b.actualSeconds ?? -1,
        cell: ({ row }) => {
          const b = row.original;
          return (
            <span className={b.late ? "font-semibold text-alarm" : undefined}>
              {minutes(b.estimateSeconds)} /{" "}
              {b.actualSeconds === null ? "not started" : `${minutes(b.actualSeconds)}${b.finishedAt ? "" : " so far"}`}
            </span>
          );
        },
      },
      ...(canAssign
        ? [
            {
              id: "act",
              header: "Change",
              enableSorting: false,
              cell: ({ row }) => {
                const b = row.original;
                if (b.floorStatus === "done") return <span className="text-sm text-ink-soft">finished</span>;
                return (
                  <button type="button" className="btn-quiet whitespace-nowrap" onClick={() => setChosen(b)}>
                    {b.pickerId ? "Move or take back" : "Assign"}
                    <span className="sr-only">
                      {" "}
                      batch {b.number} of {b.waveName}
                    </span>
                  </button>
                );
              },
            } satisfies DataColumn<FloorBatchDTO>,
          ]
        : []),
    ],
    [style, canAssign],
  );

  return (
    <div className="space-y-5">
      <p className="text-sm text-ink-soft" role="status" aria-live="polite">
        Updated {formatTimeWithSeconds(floor.at, style)}. Updates by itself every few seconds.
        {error && (
          <span className="font-semibold text-alarm">
            {" "}
            The last update failed ({error.message}); showing what was known at {formatTimeWithSeconds(floor.at, style)}
            .
          </span>
        )}
      </p>

      <section aria-label="Summary" className="flex flex-wrap gap-3">
        {FLOOR_STATUSES.map((s) => (
          <p key={s} className="card px-4 py-2" data-testid={`count-${s.replace(" ", "-")}`}>
            <span className="block text-2xl font-bold">{count(s)}</span>
            <span className="text-sm">{STATUS_LABEL[s]}</span>
          </p>
        ))}
        <p className={`card px-4 py-2 ${lateNow ? "border-alarm" : ""}`}>
          <span className={`block text-2xl font-bold ${lateNow ? "text-alarm" : ""}`}>{lateNow}</span>
          <span className="text-sm">Over their estimate now</span>
        </p>
      </section>

      <section aria-labelledby="idle-title" className="card">
        <h2 id="idle-title">Idle pickers ({idle.length})</h2>
        {idle.length === 0 ? (
          <p className="mt-1 text-ink-soft">Every picker signed in holds a batch.</p>
        ) : (
          <ul className="mt-2 flex flex-wrap gap-2" data-testid="idle-pickers">
            {idle.map((p) => (
              <li
                key={p.id}
                className="rounded-md border border-rack-light bg-paper-sunk px-3 py-1"
                data-picker-id={p.id}
              >
                <span className="font-semibold">{p.name}</span>
                <span className="text-sm text-ink-soft">
                  {" "}
                  {p.idleSince ? `idle since ${formatWhen(p.idleSince, style)}` : "idle"}
                </span>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-sm text-ink-soft">
          Pickers signed in who hold no unfinished batch. Each picker may hold up to {floor.capPerPicker} unfinished
          batches.
        </p>
      </section>

      {chosen && canAssign && (
        <AssignPanel
          batch={chosen}
          current={floor.batches.find((b) => b.id === chosen.id) ?? null}
          pickers={floor.pickers}
          cap={floor.capPerPicker}
          onClose={() => setChosen(null)}
          onChanged={async () => {
            await mutate();
          }}
        />
      )}

      <div className="flex flex-wrap gap-4">
        <div className="min-w-56">
          <label className="label" htmlFor="floor-wave">
            Wave
          </label>
          <select id="floor-wave" className="field" value={wave} onChange={(e) => setWave(e.target.value)}>
            <option value="all">All waves on the floor</option>
            {waves.map(([id, name]) => (
              <option key={id} value={String(id)}>
                {name}
              </option>
            ))}
          </select>
        </div>
        <div className="min-w-56">
          <label className="label" htmlFor="floor-status">
            Status
          </label>
          <select
            id="floor-status"
            className="field"
            value={status}
            onChange={(e) => setStatus(e.target.value as FloorStatus | "all" | "late")}
          >
            <option value="all">Every status</option>
            {FLOOR_STATUSES.map((s) => (
              <option key={s} value={s}>
                {STATUS_LABEL[s]}
              </option>
            ))}
            <option value="late">Over their estimate</option>
          </select>
        </div>
      </div>

      <DataTable
        data={shown}
        columns={columns}
        searchLabel="wave, batch or picker"
        rowId={(b) => String(b.id)}
        pageSize={50}
        empty={
          floor.batches.length === 0
            ? "No released batches on the floor. Batches show here once a planner releases a wave."
            : "No batch has this wave and status."
        }
      />
      <p className="text-sm text-ink-soft">
        Estimated {timingNote(floor.timing, floor.units)}; actual time runs from the first confirmed line to the last.
      </p>
    </div>
  );
}
