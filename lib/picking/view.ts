import "server-only";
import { getBatch } from "@/db/batches";
import { pickLines, type PickBatchRow } from "@/db/picking";
import type { PickLineState } from "@/lib/contracts/picking";
import { getLayoutVersion, getLayoutVersionById } from "@/db/layout-versions";
import { layoutGraph } from "@/lib/layout-versions/graph-cache";
import { immutableCache } from "@/lib/cache/immutable-cache";
import { documentBins } from "@/lib/floor-plan/bin-codes";
import type { EditorDocument } from "@/lib/floor-plan/document";
import { batchLegs } from "./legs";
import { cautionsOf, HIGH_LEVEL, type Caution } from "./rules";

export type { PickStopDTO, PickViewDTO } from "@/lib/contracts/picking";
import type { PickStopDTO, PickViewDTO } from "@/lib/contracts/picking";

const placeName = (doc: EditorDocument, id: string) => {
  const p = [...doc.depots, ...doc.dropoffs].find((x) => x.id === id);
  return p ? `${p.id} ${p.name}` : id;
};

type VersionFacts = { document: EditorDocument | null; highLevels: Set<string> };

// Reading and walking a layout's document costs the web server's thread more than the rest of a
// pick view; a published version never changes, so it is done once per version, not per request.
const versionFacts = immutableCache<string, VersionFacts>(8, async (key) => {
  const [siteId, layoutVersionId] = key.split(":").map(Number) as [number, number];
  const v = await getLayoutVersionById(siteId, layoutVersionId);
  const version = v ? await getLayoutVersion(siteId, v.floorPlanId, v.number) : null;
  const document = version?.document ?? null;
  return {
    document,
    highLevels: new Set(
      document
        ? documentBins(document)
            .filter((x) => x.level >= HIGH_LEVEL)
            .map((x) => x.code)
        : [],
    ),
  };
});

/** Everything the handheld shows of a batch; the document comes along for the page's map. */
export async function pickView(
  siteId: number,
  b: PickBatchRow,
): Promise<{ view: PickViewDTO; document: EditorDocument | null }> {
  const [detail, lines, facts, loaded] = await Promise.all([
    getBatch(b.waveId, b.number),
    pickLines(b.id),
    versionFacts(`${siteId}:${b.layoutVersionId}`),
    layoutGraph(b.layoutVersionId),
  ]);
  const stops = detail?.stops ?? [];
  const legs = batchLegs(
    loaded.graph,
    loaded.matrix,
    b.depotId,
    b.dropoffId,
    stops.map((s) => s.accessPoint),
  );
  const { document, highLevels } = facts;
  const view: PickViewDTO = {
    batch: {
      id: b.id,
      waveName: b.waveName,
      number: b.number,
      status: b.status,
      version: b.version,
      assignedName: b.assignedName,
    },
    depot: document ? placeName(document, b.depotId) : b.depotId,
    dropoff: document ? placeName(document, b.dropoffId) : b.dropoffId,
    stops: stops.map((s, i) => {
      const here = lines.filter((l) => l.stopSeq === s.seq);
      return {
        seq: s.seq,
        x: s.x,
        y: s.y,
        binCodes: [...new Set(here.map((l) => l.binCode))],
        lines: here,
        cautions: cautionsOf(here, highLevels),
        pathCells: legs[i]?.cells ?? [],
        legMm: legs[i]?.mm ?? 0,
      };
    }),
    finalLeg: legs[stops.length] ?? { cells: [], mm: 0 },
  };
  return { view, document };
}
