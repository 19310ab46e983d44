import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { api, ORIGIN, signInAs } from "../support/app";
import { closeDb } from "@/db/knex";
import { createdWave, planWave } from "../support/wave-plan";
import { TestOrders } from "../support/wave-orders";
import { auditedSince, auditMark } from "../support/audit";
import type { SiteDTO } from "@/lib/contracts/site";
import { minutes } from "@/lib/format/units";

// The demo site's settings are shared with every other test file: this file puts back what it found.
let admin: string;
let original: SiteDTO;
const fixtures = new TestOrders();
const TAG = `S${Date.now().toString(36).toUpperCase()}`;

const read = async (cookie = admin) => (await api().get("/api/site").set("Cookie", cookie)).body.site as SiteDTO;
const patch = (cookie: string, body: object) =>
  api().patch("/api/site").set("Cookie", cookie).set("Origin", ORIGIN).send(body);

function figuresOf(s: SiteDTO) {
  return {
    name: s.name,
    timezone: s.timezone,
    walkingSpeedMPerS: s.walkingSpeedMmPerS / 1000,
    secondsPerLine: s.secondsPerLine,
    setupSecondsPerBatch: s.setupSecondsPerBatch,
    maxOpenBatchesPerPicker: s.maxOpenBatchesPerPicker,
    dateOrder: s.dateOrder,
    clock: s.clock,
    units: s.units,
  };
}

beforeAll(async () => {
  admin = await signInAs("admin");
  original = await read();
});

afterAll(async () => {
  const now = await read();
  const back = await patch(admin, { version: now.version, ...figuresOf(original) });
  expect(back.status, JSON.stringify(back.body)).toBe(200);
  await fixtures.cleanUp();
  await closeDb();
});

describe("reading the site settings", () => {
  it("gives admins, planners and supervisors the figures estimates use; refuses pickers and strangers", async () => {
    for (const role of ["admin", "planner", "supervisor"] as const) {
      const res = await api()
        .get("/api/site")
        .set("Cookie", await signInAs(role));
      expect(res.status, role).toBe(200);
      expect(res.body.site).toMatchObject({
        id: original.id,
        timezone: expect.any(String),
        walkingSpeedMmPerS: expect.any(Number),
        secondsPerLine: expect.any(Number),
        setupSecondsPerBatch: expect.any(Number),
        maxOpenBatchesPerPicker: expect.any(Number),
        dateOrder: expect.stringMatching(/^(dmy|mdy|ymd)$/),
        clock: expect.stringMatching(/^(24h|12h)$/),
        units: expect.stringMatching(/^(metric|imperial)$/),
        version: expect.any(Number),
      });
    }
    const picker = await api()
      .get("/api/site")
      .set("Cookie", await signInAs("picker"));
    expect(picker.status).toBe(403);
    expect((await api().get("/api/site")).status).toBe(401);
  });
});

describe("saving the site settings", () => {
  it("stores every figure (walking speed given in m/s, kept in mm/s), bumps the version and audits the change", async () => {
    const before = await read();
    const mark = await auditMark();
    const res = await patch(admin, {
      version: before.version,
      name: `${before.name.replace(/ \(test .*\)$/, "")} (test ${TAG})`,
      timezone: "America/Chicago",
      walkingSpeedMPerS: 1.25,
      secondsPerLine: 18,
      setupSecondsPerBatch: 150,
      maxOpenBatchesPerPicker: 4,
      dateOrder: "ymd",
      clock: "12h",
      units: "imperial",
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const after = await read();
    expect(after).toMatchObject({
      timezone: "America/Chicago",
      walkingSpeedMmPerS: 1250,
      secondsPerLine: 18,
      setupSecondsPerBatch: 150,
      maxOpenBatchesPerPicker: 4,
      dateOrder: "ymd",
      clock: "12h",
      units: "imperial",
      dateStyle: { timeZone: "America/Chicago", dateOrder: "ymd", clock: "12h" },
      version: before.version + 1,
    });
    const [line] = await auditedSince(mark, "site.changed");
    expect(line).toBeTruthy();
    expect(line!.subject).toBe(`site ${before.id}`);
    // Saving the same figures again changes nothing but is still accepted (a resent form).
    const again = await patch(admin, { version: after.version, ...figuresOf(after) });
    expect(again.status).toBe(200);
    expect(again.body.changed).toEqual([]);
  });

  it("refuses figures out of range with a message per field, and changes nothing", async () => {
    const before = await read();
    const res = await patch(admin, {
      version: before.version,
      name: "  ",
      timezone: "Mars/Olympus_Mons",
      walkingSpeedMPerS: 9,
      secondsPerLine: 0,
      setupSecondsPerBatch: 4000,
      maxOpenBatchesPerPicker: 11,
      dateOrder: "dym",
      clock: "13h",
      units: "cubits",
    });
    expect(res.status).toBe(400);
    const paths = (res.body.issues as { path: string; message: string }[]).map((i) => i.path);
    for (const field of [
      "name",
      "timezone",
      "walkingSpeedMPerS",
      "secondsPerLine",
      "setupSecondsPerBatch",
      "maxOpenBatchesPerPicker",
      "dateOrder",
      "clock",
      "units",
    ])
      expect(paths, field).toContain(field);
    const speed = res.body.issues.find((i: { path: string }) => i.path === "walkingSpeedMPerS");
    expect(speed.message).toMatch(/2\.5 m\/s/);
    expect(await read()).toEqual(before);
  });

  it("takes only real IANA zones: offsets and abbreviations ignore summer time", async () => {
    const before = await read();
    for (const timezone of ["+01:00", "CET", "Europe/Atlantis", ""]) {
      const res = await patch(admin, { version: before.version, timezone });
      expect(res.status, timezone).toBe(400);
      expect(res.body.issues[0].path).toBe("timezone");
    }
    const ok = await patch(admin, { version: before.version, timezone: "Europe/Berlin" });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    expect(ok.body.site.timezone).toBe("Europe/Berlin");
  });

  it("refuses a body that says nothing to change, or names a field it does not know", async () => {
    const { version } = await read();
    expect((await patch(admin, { version })).status).toBe(400);
    expect((await patch(admin, { version, walkingSpeedMmPerS: 1000 })).status).toBe(400);
    expect((await patch(admin, { secondsPerLine: 15 })).status).toBe(400);
  });

  it("lets only an admin change them", async () => {
    const { version } = await read();
    for (const role of ["planner", "supervisor", "picker"] as const) {
      const res = await patch(await signInAs(role), { version, secondsPerLine: 40 });
      expect(res.status, role).toBe(403);
    }
    expect((await api().patch("/api/site").set("Origin", ORIGIN).send({ version, secondsPerLine: 40 })).status).toBe(
      401,
    );
    const foreign = await api()
      .patch("/api/site")
      .set("Cookie", admin)
      .set("Origin", "http://elsewhere.example")
      .send({ version, secondsPerLine: 40 });
    expect(foreign.status).toBe(403);
    expect((await read()).version).toBe(version);
  });

  it("two admins saving at once: one wins, the other gets 409 with the stored figures and changes nothing", async () => {
    const second = await signInAs("admin");
    for (let round = 0; round < 4; round++) {
      const { version } = await read();
      const [a, b] = await Promise.all([
        patch(admin, { version, secondsPerLine: 21 }),
        patch(second, { version, secondsPerLine: 22 }),
      ]);
      const statuses = [a.status, b.status].sort();
      expect(statuses, JSON.stringify([a.body, b.body])).toEqual([200, 409]);
      const [winner, loser] = a.status === 200 ? [a, b] : [b, a];
      expect(loser.body.error).toMatch(/Someone else saved the site settings/);
      expect(loser.body.site.version).toBe(version + 1);
      const now = await read();
      expect(now.version).toBe(version + 1);
      expect(now.secondsPerLine).toBe(winner.body.site.secondsPerLine);
    }
  });
});

describe("estimates follow the settings", () => {
  let waveId: number;
  let planner: string;

  beforeAll(async () => {
    planner = await signInAs("planner");
    const items = await fixtures.itemsOnLayout(6);
    for (let i = 0; i < 6; i++)
      await fixtures.addOrder(`${TAG}-${i + 1}`, `2024-02-0${1 + (i % 3)}T08:00:00Z`, [items[i]!]);
    const res = await createdWave(planner, fixtures, {
      name: `Settings test ${TAG}`,
      cutoffBefore: "2024-02-05T00:00:00Z",
      settings: { totesPerCart: 2, method: "savings" },
    });
    waveId = res.body.id;
    await planWave(planner, waveId);
  });

  const page = async () => {
    const res = await api().get(`/waves/${waveId}`).set("Cookie", planner);
    expect(res.status).toBe(200);
    // React puts comment markers between text parts; the note reads as one sentence without them.
    return res.text.replace(/<!-- -->/g, "");
  };

  it("the wave page names the figures it uses and its estimates change after a save", async () => {
    const { version } = await read();
    let saved = await patch(admin, {
      version,
      walkingSpeedMPerS: 1,
      secondsPerLine: 15,
      setupSecondsPerBatch: 120,
      units: "metric",
    });
    expect(saved.status).toBe(200);
    const batches = (await api().get(`/api/waves/${waveId}`).set("Cookie", planner)).body.batches as {
      distanceMm: number;
      lineCount: number;
    }[];
    expect(batches.length).toBeGreaterThan(0);
    // Walk / speed + lines × time per line + set-up, for each batch, summed (the formula, written out).
    const total = (speedMmS: number, perLine: number, setup: number) =>
      batches.reduce((a, b) => a + b.distanceMm / speedMmS + b.lineCount * perLine + setup, 0);
    const expected = (speedMmS: number, perLine: number, setup: number) => minutes(total(speedMmS, perLine, setup));

    const before = await page();
    expect(before).toContain("at 1.0 m/s walking, 15 s per line, 2 min set-up per batch (site settings)");
    expect(before).toContain("Estimated finish");
    expect(before).toContain(`>${expected(1000, 15, 120)}<`);

    saved = await patch(admin, {
      version: saved.body.site.version,
      walkingSpeedMPerS: 0.8,
      secondsPerLine: 30,
      setupSecondsPerBatch: 300,
    });
    expect(saved.status).toBe(200);
    const after = await page();
    expect(after).toContain("at 0.8 m/s walking, 30 s per line, 5 min set-up per batch (site settings)");
    expect(after).toContain(`>${expected(800, 30, 300)}<`);
    expect(total(800, 30, 300)).toBeGreaterThan(total(1000, 15, 120) + 60);

    // The batch page and the printed pick lists say the same.
    const batch = await api().get(`/waves/${waveId}/batches/1`).set("Cookie", planner);
    expect(batch.text.replace(/<!-- -->/g, "")).toContain("at 0.8 m/s walking, 30 s per line, 5 min set-up per batch");
    const print = await api().get(`/waves/${waveId}/print`).set("Cookie", planner);
    expect(print.text.replace(/<!-- -->/g, "")).toContain("at 0.8 m/s walking, 30 s per line, 5 min set-up per batch");
  });

  it("imperial units show the walking speed in ft/s and the wave's walks in feet", async () => {
    const { version } = await read();
    const saved = await patch(admin, { version, units: "imperial", walkingSpeedMPerS: 1 });
    expect(saved.status).toBe(200);
    const html = await page();
    expect(html).toContain("at 3.28 ft/s walking");
    expect(html).toMatch(/\d ft</);
  });
});
