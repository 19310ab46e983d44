/** Thrown when the caller's shouldStop() asks a running batching job to give up. */
export class BatchingCancelled extends Error {
  /** Batches fully planned before the stop was noticed. */
  readonly batchesDone: number;
  constructor(batchesDone: number) {
    super(`batching cancelled after ${batchesDone} batch${batchesDone === 1 ? "" : "es"}`);
    this.name = "BatchingCancelled";
    this.batchesDone = batchesDone;
  }
}
