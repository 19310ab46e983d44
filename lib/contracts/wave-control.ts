// What the wave editor and the recall panel exchange with the server. Types only: the client imports this file.

/** One order as the wave editor lists it (in the wave, or open to add). */
export type WaveOrderRowDTO = {
  id: number;
  orderNumber: string;
  cutoffAt: string | null;
  priority: number;
  lineCount: number;
};

export type WaveOrdersDTO = {
  inWave: WaveOrderRowDTO[];
  /** Open orders no wave holds, most urgent first, at most `CANDIDATE_LIMIT` of `candidateCount`. */
  candidates: WaveOrderRowDTO[];
  candidateCount: number;
};

export const CANDIDATE_LIMIT = 200;

/** A released batch nobody has confirmed a line of. */
export type RecallableBatchDTO = {
  number: number;
  version: number;
  lineCount: number;
  orderCount: number;
  heldBy: string | null;
};
