// What the supervisor's floor page gets from GET /api/floor, and what assigning a batch answers. Types only.

/** Where a released batch is in its day: nobody holds it, held and not begun, lines being confirmed, picked. */
export const FLOOR_STATUSES = ["waiting", "taken", "in progress", "done"] as const;
export type FloorStatus = (typeof FLOOR_STATUSES)[number];

export type HandoverKind = "assigned" | "taken-back" | "moved";

export type FloorBatchDTO = {
  id: number;
  waveId: number;
  waveName: string;
  number: number;
  /** The batch's own status as stored (released, picking, done). */
  status: string;
  floorStatus: FloorStatus;
  /** Sent back with an assignment, so a change made meanwhile is refused instead of overwritten. */
  version: number;
  pickerId: string | null;
  pickerName: string | null;
  takenAt: string | null;
  startedAt: string | null;
  finishedAt: string | null;
  lineCount: number;
  doneLines: number;
  shortLines: number;
  estimateSeconds: number;
  /** Finished − started, or the running time so far; null before the first line. */
  actualSeconds: number | null;
  late: boolean;
  /** The last time a supervisor assigned, took back or moved it. */
  lastHandover: { kind: HandoverKind; byName: string | null; toName: string | null; at: string } | null;
};

export type FloorPickerDTO = {
  id: string;
  name: string;
  /** Taken and not finished: what counts against the site's cap. */
  openBatches: number;
  /** Signed in on a handheld or a browser now (a session that has not ended). */
  onShift: boolean;
  /** For a picker holding nothing unfinished: since the last batch finished, was moved away, or they signed in. */
  idleSince: string | null;
};

export type FloorDTO = {
  /** The server's clock when the answer was made: running times count to it. */
  at: string;
  capPerPicker: number;
  /** The figures the estimates use, and the units the site shows them in. */
  timing: { walkingSpeedMmPerS: number; secondsPerLine: number; setupSecondsPerBatch?: number };
  units: "metric" | "imperial";
  batches: FloorBatchDTO[];
  pickers: FloorPickerDTO[];
};
