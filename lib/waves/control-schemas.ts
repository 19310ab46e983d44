import { z } from "zod";
import { rowId, rowVersion } from "@/lib/http/body-fields";
import { elementId } from "@/lib/floor-plan/document";

// The bodies of the wave editor's requests. A new wave (app/api/waves/route.ts) takes the same name
// and settings, all of them at once.

export const WaveName = z.string().trim().min(1, "Name the wave, e.g. “Tuesday morning”.").max(120);

/** How a wave is cut into carts and walked. */
export const WaveSettings = z.object({
  totesPerCart: z.number().int().min(1, "A cart carries at least one tote.").max(40),
  maxLines: z.number().int().min(1).max(500),
  maxWeightG: z.number().int().min(1000, "Allow at least 1 kg per cart.").max(1_000_000),
  // The editor's ids of the layout version's depot and drop-off.
  depotId: elementId,
  dropoffId: elementId,
  method: z.enum(["first-come", "savings"]),
});

export const WaveEditBody = z
  .object({
    version: rowVersion(),
    name: WaveName.optional(),
    settings: WaveSettings.partial().optional(),
  })
  .refine((b) => b.name !== undefined || (b.settings && Object.keys(b.settings).length > 0), {
    message: "Change the name or a setting: nothing was sent to save.",
    path: ["name"],
  });

const OrderFilter = z.object({
  cutoffBefore: z.iso.datetime({ offset: true, error: "Give the cut-off as a date and time." }).optional(),
  priorities: z.array(z.number().int().min(1).max(3)).min(1, "Tick at least one priority.").max(3).optional(),
  // With a cut-off set, orders that have none are left out unless the planner asks for them.
  includeNoCutoff: z.boolean().optional(),
});

const ids = z.array(rowId("order")).max(5000, "At most 5,000 orders at a time.");

export const WaveOrdersBody = z
  .object({
    version: rowVersion(),
    add: ids.optional(),
    remove: ids.optional(),
    addMatching: OrderFilter.optional(),
    removeMatching: OrderFilter.optional(),
  })
  .refine((b) => !!(b.add?.length || b.remove?.length || b.addMatching || b.removeMatching), {
    message: "Choose orders to add or remove, or a filter.",
    path: ["add"],
  });

export const RecallBody = z.object({ version: rowVersion() });
