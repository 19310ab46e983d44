import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { loadLayoutGraph } from "@/db/layout-versions";
import { planPick } from "@/lib/routing/plan";
import { EXACT_LIMIT } from "@/lib/routing/sequence";
import type { CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { BatchSummaryDTO } from "@/lib/contracts/batches";
import { plannedCertificateWave } from "../support/certificate-wave";
import { TestOrders } from "../support/wave-orders";

// A planned wave's batches carry their route's certificate through the API and onto the batch page
// and the pick list: the stored bound and method are the engine's own for the stored stops (a fresh
// planPick on the stored layout), the bound never passes the walk, and the words say which case it is.
const TAG = `C${Date.now().toString(36).toUpperCase()}`;
const PROVED = /^shortest — (proved by .+|its length meets a proved lower bound)$/;
const BOUNDED = /^at most \d+(\.\d)? % above the shortest possible walk \(found by .+\)$/;
const UNBOUNDED = /^found by .+; no bound on how far from the shortest it is$/;

const fixtures = new TestOrders();
let planner: string;
let layout: { graph: CompactGraph; matrix: DistanceMatrix };
let waveId: number;
let batches: BatchSummaryDTO[];

beforeAll(async () => {
  planner = await signInAs("planner");
  layout = await loadLayoutGraph(1);
  waveId = await plannedCertificateWave(fixtures, planner, TAG);
  batches = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.batches;
});

afterAll(async () => {
  await fixtures.cleanUp();
  await closeDb();
});

describe("a route's certificate", () => {
  it("comes back from the API with every batch: a bound no longer than the walk, the method and the words", async () => {
    expect(batches.length).toBeGreaterThanOrEqual(2);
    expect(
      batches.some((b) => b.stopCount > EXACT_LIMIT),
      "one batch has more stops than the exact limit",
    ).toBe(true);
    for (const b of batches) {
      expect(b.lowerBoundMm).toBeGreaterThanOrEqual(0);
      expect(b.lowerBoundMm).toBeLessThanOrEqual(b.distanceMm);
      expect(["held-karp", "corridor-dp", "lp-cuts", "local-search"]).toContain(b.method);
      expect(b.optimal).toBe(b.lowerBoundMm === b.distanceMm);
      expect(b.certificate).toMatch(b.optimal ? PROVED : b.lowerBoundMm > 0 ? BOUNDED : UNBOUNDED);
      if (b.stopCount <= EXACT_LIMIT) expect(b.certificate, `batch ${b.number}`).toMatch(PROVED);
    }
  });

  it("is the engine's own: a fresh plan of the stored stops gives the same length, bound and method", async () => {
    for (const b of batches) {
      const codes = await db()("batch_lines")
        .where({ batch_id: b.id })
        .orderBy([{ column: "tote" }, { column: "order_line_id" }])
        .pluck("bin_code");
      const fresh = planPick(layout.graph, layout.matrix, { from: "D1", to: "P1", binCodes: codes });
      expect([b.distanceMm, b.lowerBoundMm, b.method]).toEqual([fresh.lengthMm, fresh.lowerBoundMm, fresh.method]);
      const row = await db()("batches").where({ id: b.id }).first("lower_bound_mm", "method");
      expect([row.lower_bound_mm, row.method]).toEqual([b.lowerBoundMm, b.method]);
    }
  });

  it("is printed in words on the wave page, the batch page and the pick list", async () => {
    const wavePage = (await api().get(`/waves/${waveId}`).set("Cookie", planner)).text.replace(/<!-- -->/g, "");
    for (const b of batches) expect(wavePage).toContain(b.certificate);
    expect(wavePage).not.toMatch(/✓ exact|≈ heuristic/);
    for (const b of batches) {
      for (const url of [`/waves/${waveId}/batches/${b.number}`, `/waves/${waveId}/batches/${b.number}/print`]) {
        const page = await api().get(url).set("Cookie", planner);
        expect(page.status, url).toBe(200);
        const text = page.text.replace(/<!-- -->/g, "");
        expect(text, url).toContain(`Route:</span> ${b.certificate}`);
        expect(text, url).not.toMatch(/heuristic route|exact route/);
      }
    }
  });
});
