// Wave planning core: pure TypeScript (no database, framework or Node-only APIs) so it runs in a worker.
export * from "./types";
export { batchOrders, binCodesOf, type BatchingOptions } from "./batching";
export { BatchingCancelled } from "./errors";
export { estimateSeconds, DEFAULT_SITE_TIMING, siteTiming, type SiteTiming } from "./estimate";
export type { SavingsOptions } from "./savings";
export { compareUrgency, cutoffMs } from "./urgency";
