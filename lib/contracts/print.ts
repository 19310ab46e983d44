// One printed pick list, as lib/print/pick-list-data.ts gathers it and components/print/PickList.tsx
// lays it out. Types only.
import type { BatchDetailDTO } from "./batches";
import type { EditorDocument } from "@/lib/floor-plan/document";

export type PickListData = {
  label: string;
  barcodeSvg: string;
  waveName: string;
  batch: BatchDetailDTO;
  printedBefore: number;
  seconds: number;
  /** Which figures the estimate uses ("at 1.0 m/s walking, …"). */
  estimateNote?: string;
  document: EditorDocument;
  routeCells: number[];
  dropoff: string;
  /** Bins out of reach from the floor, marked on the list. */
  highLevels: Set<string>;
};
