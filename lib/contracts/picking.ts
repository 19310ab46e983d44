// What a picker's handheld gets from the picking API. Types only.
import type { Caution } from "@/lib/picking/rules";

export type PickBatchStatus = "planned" | "released" | "picking" | "done" | "recalled";

export type PickStatus = "open" | "picked" | "short";

export type PickLineState = {
  orderLineId: number;
  stopSeq: number;
  tote: number;
  binCode: string;
  orderNumber: string;
  sku: string;
  description: string;
  quantity: number;
  uom: string;
  unitWeightG: number;
  pickStatus: PickStatus;
  pickedQty: number | null;
  shortReason: string | null;
};

/** A batch as picking names it: which wave, which number, and the version a change must name. */
export type PickBatchRef = {
  id: number;
  waveId: number;
  waveName: string;
  number: number;
  status: PickBatchStatus;
  version: number;
};

export type MyBatchDTO = PickBatchRef & {
  stopCount: number;
  lineCount: number;
  openLines: number;
  shortLines: number;
  /** Who put it on this picker's handheld, when a supervisor did (not the picker's own take). */
  assignedBy?: { name: string; at: string } | null;
};

export type PickStopDTO = {
  seq: number;
  x: number;
  y: number;
  binCodes: string[];
  lines: PickLineState[];
  cautions: Caution[];
  /** The path from the previous stop (the depot for the first), as floor-plan cells. */
  pathCells: number[];
  legMm: number;
};

export type PickViewDTO = {
  /** `version` goes back with every confirmation: it changes when the batch is taken or given back. */
  batch: {
    id: number;
    waveName: string;
    number: number;
    status: PickBatchStatus;
    version: number;
    assignedName: string | null;
  };
  depot: string;
  dropoff: string;
  stops: PickStopDTO[];
  finalLeg: { cells: number[]; mm: number };
};
