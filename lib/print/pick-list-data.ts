import "server-only";
import { getBatch, listBatches } from "@/db/batches";
import { printCounts } from "@/db/batch-prints";
import type { WaveDTO } from "@/lib/contracts/waves";
import { getLayoutVersion, getLayoutVersionById } from "@/db/layout-versions";
import { getSite } from "@/db/sites";
import { layoutGraph } from "@/lib/layout-versions/graph-cache";
import { batchRouteCells } from "@/lib/waves/batch-route";
import { documentBins } from "@/lib/floor-plan/bin-codes";
import { estimateSeconds, siteTiming, timingNote } from "@/lib/batching/estimate";
import type { PickListData } from "@/lib/contracts/print";
import { HIGH_LEVEL } from "@/lib/picking/rules";
import { code128Svg } from "./barcode";
import { batchLabel } from "./batch-label";

/** Everything the pick lists of a wave's batches show; `numbers` picks some, default all. */
export async function pickListsOf(siteId: number, wave: WaveDTO, numbers?: number[]): Promise<PickListData[]> {
  const v = await getLayoutVersionById(siteId, wave.layoutVersionId);
  const version = v ? await getLayoutVersion(siteId, v.floorPlanId, v.number) : null;
  if (!version) return [];
  const [{ graph, matrix }, site, counts, all] = await Promise.all([
    layoutGraph(wave.layoutVersionId),
    getSite(siteId),
    printCounts(wave.id),
    listBatches(wave.id),
  ]);
  const timing = siteTiming(site);
  const highLevels = new Set(
    documentBins(version.document)
      .filter((b) => b.level >= HIGH_LEVEL)
      .map((b) => b.code),
  );
  const dropoff = [...version.document.dropoffs, ...version.document.depots].find(
    (p) => p.id === wave.settings.dropoffId,
  );
  const out: PickListData[] = [];
  for (const summary of all) {
    if (numbers && !numbers.includes(summary.number)) continue;
    const batch = await getBatch(wave.id, summary.number);
    if (!batch) continue;
    const label = batchLabel(wave.id, batch.number);
    out.push({
      label,
      barcodeSvg: code128Svg(label),
      waveName: wave.name,
      batch,
      printedBefore: counts.get(batch.number) ?? 0,
      seconds: estimateSeconds({ distanceMm: batch.distanceMm, lines: batch.lineCount }, timing),
      estimateNote: timingNote(timing, site?.units),
      document: version.document,
      routeCells: batchRouteCells(
        graph,
        matrix,
        wave.settings.depotId,
        wave.settings.dropoffId,
        batch.stops.map((s) => s.accessPoint),
      ).cells,
      dropoff: dropoff ? `${dropoff.name} (${dropoff.id})` : wave.settings.dropoffId,
      highLevels,
    });
  }
  return out;
}
