import "server-only";
import { floorBatches, floorPickers, lastHandovers } from "@/db/shift-floor";
import { getSite } from "@/db/sites";
import { estimateSeconds, siteTiming } from "@/lib/batching/estimate";
import type { FloorDTO } from "@/lib/contracts/shift";
import { actualTime, floorStatusOf, idleSince } from "./floor-status";

/** Everything the floor page shows, as of now. */
export async function floorView(siteId: number): Promise<FloorDTO> {
  const [site, rows, pickers] = await Promise.all([getSite(siteId), floorBatches(siteId), floorPickers(siteId)]);
  const timing = siteTiming(site);
  const now = new Date();
  const handovers = await lastHandovers(rows.map((r) => r.id));
  return {
    at: now.toISOString(),
    capPerPicker: site?.maxOpenBatchesPerPicker ?? 3,
    timing,
    units: site?.units ?? "metric",
    batches: rows.map((r) => {
      const estimate = Math.round(estimateSeconds({ distanceMm: r.distanceMm, lines: r.lineCount }, timing));
      const h = handovers.get(r.id);
      return {
        id: r.id,
        waveId: r.waveId,
        waveName: r.waveName,
        number: r.number,
        status: r.status,
        floorStatus: floorStatusOf(r),
        version: r.version,
        pickerId: r.pickerId,
        pickerName: r.pickerName,
        takenAt: r.takenAt,
        startedAt: r.startedAt,
        finishedAt: r.finishedAt,
        lineCount: r.lineCount,
        doneLines: r.doneLines,
        shortLines: r.shortLines,
        estimateSeconds: estimate,
        ...actualTime(r, estimate, now),
        lastHandover: h ? { kind: h.kind, byName: h.byName, toName: h.toName, at: h.at } : null,
      };
    }),
    pickers: pickers.map((p) => ({
      id: p.id,
      name: p.name,
      openBatches: p.openBatches,
      onShift: p.onShift,
      idleSince: idleSince(p),
    })),
  };
}
