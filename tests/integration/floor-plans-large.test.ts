import { afterAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signInAs } from "../support/app";
import { closeDb, db } from "@/db/knex";
import { loadLayoutGraph } from "@/db/layout-versions";
import { blankDocument, GROUND, type EditorDocument } from "@/lib/floor-plan/document";
import { toGridDrawing } from "@/lib/floor-plan/to-drawing";
import { UNREACHABLE } from "@/lib/routing/constants";
import { run } from "../support/documents";
import { dijkstraLengths, rawGridGraph } from "../routing/helpers/raw-grid";

afterAll(closeDb);

let n = 0;
async function planWith(cookie: string, document: EditorDocument): Promise<{ id: number; version: number }> {
  const made = await api()
    .post("/api/floor-plans")
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ name: `Large floor ${Date.now()}-${++n}`, widthM: 12, heightM: 7, cellMm: 1000 });
  expect(made.status).toBe(201);
  const saved = await api()
    .put(`/api/floor-plans/${made.body.id}/draft`)
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ version: 1, document });
  expect(saved.status, JSON.stringify(saved.body).slice(0, 300)).toBe(200);
  return { id: made.body.id, version: saved.body.version };
}

async function jobOutcome(cookie: string, jobId: string, seconds: number) {
  for (let i = 0; i < seconds * 5; i++) {
    const res = await api().get(`/api/jobs/${jobId}`).set("Cookie", cookie);
    if (["done", "failed", "cancelled"].includes(res.body.job?.status)) return res.body.job;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error("job did not finish");
}

/**
 * A 77 × 80 m hall with a building column on every other metre both ways (nothing to compress: about
 * 1,500 junctions), a cross-aisle along the front and a rack run facing it.
 */
function columnHall(): EditorDocument {
  const w = 77;
  const h = 80;
  const d = blankDocument(w, h, 1000);
  const ground: string[] = [];
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++)
      ground.push(
        y >= h - 2 ? GROUND.blocked : y < h - 3 && x % 2 === 1 && y % 2 === 1 ? GROUND.blocked : GROUND.floor,
      );
  d.ground = ground.join("");
  d.rackRuns = [run({ id: "R1", x: 2, y: h - 2, length: 70, facing: "N", aisle: 1 })];
  d.depots = [{ id: "D1", x: 0, y: h - 3, name: "Carts" }];
  d.dropoffs = [{ id: "P1", x: w - 1, y: h - 3, name: "Packing" }];
  return d;
}

describe("publishing a large floor plan", () => {
  it("stores distance matrices larger than one MariaDB packet in pieces and reads them back whole, checksum verified", async () => {
    const admin = await signInAs("admin");
    const doc = columnHall();
    const { id, version } = await planWith(admin, doc);
    const start = await api()
      .post(`/api/floor-plans/${id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version });
    expect(start.status, JSON.stringify(start.body).slice(0, 500)).toBe(202);
    const job = await jobOutcome(admin, start.body.jobId, 200);
    expect(job.message).not.toMatch(/insert into|select |`/i);
    expect(job.status, job.message).toBe("done");

    const stored = await loadLayoutGraph(job.result.layoutVersionId);
    expect(stored.checksumOk).toBe(true);
    const junctions = stored.graph.nodes.length;
    const packet = Number((await db().raw("SELECT @@max_allowed_packet AS p"))[0][0].p);
    // dist and next are each n² Int32s: together they would not fit in one packet.
    expect(8 * junctions ** 2).toBeGreaterThan(packet);
    expect(stored.matrix.dist.length).toBe(junctions ** 2);
    const [pieces] = await db().raw(
      "SELECT COUNT(*) AS n, MAX(LENGTH(bytes)) AS largest FROM layout_matrix_chunks WHERE layout_version_id = ?",
      [job.result.layoutVersionId],
    );
    expect(Number(pieces[0].n)).toBeGreaterThan(2);
    // Sent as hex, a piece's statement is about twice its bytes: it must fit in a packet with room to spare.
    expect(2 * Number(pieces[0].largest)).toBeLessThan(packet / 2);

    // Outside check: the stored distances between a few junctions equal Dijkstra (graphology) on the raw cell grid.
    const drawing = toGridDrawing(doc);
    const raw = rawGridGraph(drawing);
    const cell = (node: number) => String(stored.graph.nodes[node]!.y * drawing.width + stored.graph.nodes[node]!.x);
    for (const from of [0, Math.floor(junctions / 3), junctions - 1]) {
      const lengths = dijkstraLengths(raw, cell(from));
      for (let to = 0; to < junctions; to += 37)
        expect(stored.matrix.dist[from * junctions + to]).toBe(lengths.get(cell(to)) ?? UNREACHABLE);
    }

    const d = await api()
      .get(`/api/layout-versions/${job.result.layoutVersionId}/distance?from=01-01-1&to=01-70-2`)
      .set("Cookie", admin);
    expect(d.status).toBe(200);
    expect(d.body.distanceMm).toBe(69_000);
  }, 300_000);
});

describe("location codes too long for the database", () => {
  it("are refused before publishing, naming the pattern, and the answer carries no SQL", async () => {
    const admin = await signInAs("admin");
    const doc = blankDocument(12, 7, 1000);
    doc.ground = GROUND.floor.repeat(12 * 7);
    const pattern = "WAREHOUSE-{aisle:9}-{bay:9}-{level:9}";
    doc.rackRuns = [run({ id: "R1", x: 1, y: 2, length: 10, facing: "S", aisle: 1, pattern })];
    doc.depots = [{ id: "D1", x: 0, y: 6, name: "Carts" }];
    doc.dropoffs = [{ id: "P1", x: 11, y: 6, name: "Packing" }];
    const { id, version } = await planWith(admin, doc);
    const res = await api()
      .post(`/api/floor-plans/${id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version });
    const answer = res.status === 202 ? await jobOutcome(admin, res.body.jobId, 60) : res.body;
    expect(JSON.stringify(answer)).not.toMatch(/insert into|layout_bins|`/i);
    expect(res.status).toBe(422);
    const messages = res.body.problems.map((p: { message: string }) => p.message).join("\n");
    expect(messages).toContain(pattern);
    expect(messages).toContain("WAREHOUSE-000000001-000000001-000000001");
  });
});
