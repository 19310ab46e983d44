// What a picker's handheld gets from the picking API. Types only.

export type PickBatchStatus = "planned" | "released" | "picking" | "done";

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
};
