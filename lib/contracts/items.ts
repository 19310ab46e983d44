// The item master as GET /api/items lists it. Types only.

export type ItemDTO = {
  sku: string;
  description: string;
  uom: string;
  unitWeightG: number;
  bins: string[];
  /** Its bins flagged for replenishment after a short pick, until someone clears the flag. */
  replenishBins?: string[];
};
