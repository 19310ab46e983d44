import { afterAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN, signIn, signInAs } from "../support/app";
import { smallDocument } from "../support/documents";
import { closeDb } from "@/db/knex";
import { bytesToInt32, countLayoutRows, loadLayoutGraph, matrixChecksum, int32ToBytes } from "@/db/layout-versions";
import { buildLayout } from "@/lib/layout-versions/build";
import { accessDistance } from "@/lib/routing/access";
import { findBin } from "@/lib/routing/graph";
import * as XLSX from "xlsx";
import { waitForJob } from "../support/jobs";

afterAll(closeDb);

let n = 0;
async function newPlan(cookie: string) {
  const res = await api()
    .post("/api/floor-plans")
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ name: `Test floor ${Date.now()}-${++n}`, widthM: 12, heightM: 7, cellMm: 1000 });
  expect(res.status).toBe(201);
  return res.body.id as number;
}

async function saveSmall(cookie: string, id: number, version = 1) {
  const res = await api()
    .put(`/api/floor-plans/${id}/draft`)
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ version, document: smallDocument() });
  expect(res.status).toBe(200);
  return res.body.version as number;
}

describe("drafts", () => {
  it("saves with the version it loaded, and a stale save gets 409 without overwriting", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    const v2 = await saveSmall(admin, id, 1);
    expect(v2).toBe(2);
    const other = smallDocument();
    other.depots[0]!.name = "Somebody else's";
    const stale = await api()
      .put(`/api/floor-plans/${id}/draft`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 1, document: other });
    expect(stale.status).toBe(409);
    expect(stale.body.error).toMatch(/Reload/);
    expect(stale.body.current.version).toBe(2);
    const now = await api().get(`/api/floor-plans/${id}/draft`).set("Cookie", admin);
    expect(now.body.draft.document.depots[0].name).toBe("Carts");
  });

  it("a repeated save of the same document (a retry on flaky Wi-Fi) answers like the first", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    await saveSmall(admin, id, 1);
    const again = await api()
      .put(`/api/floor-plans/${id}/draft`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 1, document: smallDocument() });
    expect(again.status).toBe(200);
    expect(again.body.version).toBe(2);
  });

  it("a malformed document gets 400 naming what is wrong", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    const bad = { ...smallDocument(), ground: "fff" };
    const res = await api()
      .put(`/api/floor-plans/${id}/draft`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 1, document: bad });
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.issues)).toMatch(/one entry per cell/);
  });

  it("a planner can read a draft but not save it", async () => {
    const admin = await signInAs("admin");
    const planner = await signInAs("planner");
    const id = await newPlan(admin);
    expect((await api().get(`/api/floor-plans/${id}/draft`).set("Cookie", planner)).status).toBe(200);
    const res = await api()
      .put(`/api/floor-plans/${id}/draft`)
      .set("Cookie", planner)
      .set("Origin", ORIGIN)
      .send({ version: 1, document: smallDocument() });
    expect(res.status).toBe(403);
  });
});

describe("publishing", () => {
  it("stores nodes, edges, bins and matrices that match a fresh computation", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    const version = await saveSmall(admin, id, 1);
    const start = await api()
      .post(`/api/floor-plans/${id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version });
    expect(start.status).toBe(202);
    // A second click joins the same job instead of publishing twice.
    const again = await api()
      .post(`/api/floor-plans/${id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version });
    expect(again.body.jobId).toBe(start.body.jobId);
    const job = await waitForJob(admin, start.body.jobId);
    expect(job.status).toBe("done");
    expect(job.result.number).toBe(1);

    const fresh = await buildLayout(smallDocument());
    const rows = await countLayoutRows(job.result.layoutVersionId);
    expect(rows).toEqual({
      nodes: fresh.graph.nodes.length,
      edges: fresh.graph.edges.length,
      accessPoints: fresh.graph.accessPoints.length,
      bins: fresh.graph.bins.length,
    });
    expect(rows.bins).toBe(2 * 10 * 2);
    const stored = await loadLayoutGraph(job.result.layoutVersionId);
    expect(stored.checksumOk).toBe(true);
    expect(matrixChecksum(int32ToBytes(fresh.matrix.dist), int32ToBytes(fresh.matrix.next))).toBe(
      matrixChecksum(int32ToBytes(stored.matrix.dist), int32ToBytes(stored.matrix.next)),
    );
    expect(Array.from(bytesToInt32(int32ToBytes(fresh.matrix.dist)))).toEqual(Array.from(stored.matrix.dist));

    // The distance the app answers is the engine's on the fresh graph.
    const a = findBin(fresh.graph, "01-01-1")!;
    const b = findBin(fresh.graph, "01-20-2")!;
    const expected = accessDistance(
      fresh.graph,
      fresh.matrix,
      fresh.graph.accessPoints[a.accessPoint]!,
      fresh.graph.accessPoints[b.accessPoint]!,
    );
    const d = await api()
      .get(`/api/layout-versions/${job.result.layoutVersionId}/distance?from=01-01-1&to=01-20-2`)
      .set("Cookie", admin);
    expect(d.status).toBe(200);
    expect(d.body.distanceMm).toBe(expected);
    expect(d.body.cells.length).toBeGreaterThan(1);
  });

  it("two admins publishing the same save at once: exactly one publishes, the other gets 409 naming who did", async () => {
    const admin = await signInAs("admin");
    const other = await makeUser("admin");
    const otherCookie = await signIn(other.email, other.password);
    const id = await newPlan(admin);
    const version = await saveSmall(admin, id, 1);
    const publish = (cookie: string) =>
      api().post(`/api/floor-plans/${id}/publish`).set("Cookie", cookie).set("Origin", ORIGIN).send({ version });
    const answers = await Promise.all([publish(admin), publish(otherCookie)]);
    expect(answers.map((a) => a.status).sort()).toEqual([202, 409]);
    const winner = answers.find((a) => a.status === 202)!;
    const loser = answers.find((a) => a.status === 409)!;
    expect(loser.body.error).toMatch(/is publishing this save|has already published this save/);
    expect(loser.body.jobId).toBe(winner.body.jobId);
    const winnerName = (
      await api()
        .get("/api/session")
        .set("Cookie", winner === answers[0] ? admin : otherCookie)
    ).body.user.displayName;
    expect(loser.body.error).toContain(winnerName);
    const job = await waitForJob(admin, winner.body.jobId);
    expect(job.status).toBe("done");
    // Still refused once it is done, and only one version exists.
    const late = await publish(winner === answers[0] ? otherCookie : admin);
    expect(late.status).toBe(409);
    expect(late.body.error).toMatch(/has already published this save/);
    const versions = await api().get(`/api/floor-plans/${id}/versions`).set("Cookie", admin);
    expect(versions.status).toBe(200);
    expect(versions.body.versions).toHaveLength(1);
  });

  it("a draft with problems is refused with the list of problems", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    const doc = smallDocument();
    doc.dropoffs = [];
    const saved = await api()
      .put(`/api/floor-plans/${id}/draft`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 1, document: doc });
    expect(saved.status).toBe(200);
    const res = await api()
      .post(`/api/floor-plans/${id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 2 });
    expect(res.status).toBe(422);
    expect(res.body.problems.length).toBeGreaterThan(0);
  });

  it("publishing an out-of-date save gets 409", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    await saveSmall(admin, id, 1);
    const res = await api()
      .post(`/api/floor-plans/${id}/publish`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .send({ version: 1 });
    expect(res.status).toBe(409);
  });
});

describe("rack run bins from a spreadsheet", () => {
  function sheet(rows: (string | number)[][]): Buffer {
    const book = XLSX.utils.book_new();
    XLSX.utils.book_append_sheet(book, XLSX.utils.aoa_to_sheet(rows), "Bins");
    return XLSX.write(book, { type: "buffer", bookType: "xlsx" }) as Buffer;
  }

  it("exports the run's bins and reads edited codes back", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    await saveSmall(admin, id, 1);
    const exported = await api()
      .get(`/api/floor-plans/${id}/rack-runs/R1/bins?format=csv`)
      .set("Cookie", admin)
      .buffer(true);
    expect(exported.status).toBe(200);
    const lines = exported.text.trim().split(/\r\n/);
    expect(lines[0]).toBe("Location code,Aisle,Bay,Level");
    expect(lines).toHaveLength(1 + 10 * 2);
    const res = await api()
      .post(`/api/floor-plans/${id}/rack-runs/R1/bins`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .attach(
        "file",
        sheet([
          ["Location code", "Bay", "Level"],
          ["SPECIAL-1", 1, 1],
          ["01-02-1", 2, 1],
        ]),
        "bins.xlsx",
      );
    expect(res.status).toBe(200);
    expect(res.body.customCodes).toEqual([{ bay: 1, level: 1, code: "SPECIAL-1" }]);
  });

  it("reports every bad row with its row number", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    await saveSmall(admin, id, 1);
    const res = await api()
      .post(`/api/floor-plans/${id}/rack-runs/R1/bins`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .attach(
        "file",
        sheet([
          ["Location code", "Bay", "Level"],
          ["OK-1", 1, 1],
          ["X", 99, 1],
          ["Y", 2, 7],
          ["OK-1", 3, 1],
          ["01-11-1", 4, 1],
        ]),
        "bins.xlsx",
      );
    expect(res.status).toBe(400);
    expect(res.body.rows.map((r: { row: number }) => r.row)).toEqual([3, 4, 5, 6]);
    expect(res.body.rows[3].message).toMatch(/another rack run/);
  });

  it("refuses a file that is not a spreadsheet", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    await saveSmall(admin, id, 1);
    const res = await api()
      .post(`/api/floor-plans/${id}/rack-runs/R1/bins`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .attach("file", Buffer.from([0, 1, 2, 3, 0, 9]), "bins.xlsx");
    expect(res.status).toBe(415);
  });
});

describe("background picture", () => {
  const PNG = Buffer.from(
    "89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082",
    "hex",
  );

  it("stores a PNG under a random name and serves it back to the site", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    const up = await api()
      .post(`/api/floor-plans/${id}/background`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .attach("file", PNG, "../../etc/passwd.png");
    expect(up.status).toBe(201);
    expect(up.body.fileId).toMatch(/^[a-f0-9]{32}$/);
    const got = await api()
      .get(`/api/floor-plans/${id}/background/${up.body.fileId}`)
      .set("Cookie", admin)
      .buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers["content-type"]).toBe("image/png");
  });

  it("refuses something that is not a PNG or JPEG", async () => {
    const admin = await signInAs("admin");
    const id = await newPlan(admin);
    const up = await api()
      .post(`/api/floor-plans/${id}/background`)
      .set("Cookie", admin)
      .set("Origin", ORIGIN)
      .attach("file", Buffer.from("<svg onload=alert(1)>"), "x.png");
    expect(up.status).toBe(415);
  });
});
