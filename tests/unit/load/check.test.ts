import { describe, expect, it } from "vitest";
import { checkLedger, type SentConfirmation } from "../../../scripts/load/check";
import type { StoredConfirmation, StoredPickLine } from "@/db/picking-ledger";

// A small run: line 1 picked (its key resent once), line 2 short, line 3 refused for a wrong scan and
// then picked with a new key, line 4 never reached.
const U = "u1";
const sent = (): SentConfirmation[] => [
  { key: "k1", batchId: 9, orderLineId: 1, userId: U, quantity: 2, short: false, statuses: [200, 200] },
  { key: "k2", batchId: 9, orderLineId: 2, userId: U, quantity: 0, short: true, statuses: [200] },
  { key: "k3", batchId: 9, orderLineId: 3, userId: U, quantity: 1, short: false, statuses: [422] },
  { key: "k4", batchId: 9, orderLineId: 3, userId: U, quantity: 1, short: false, statuses: [200] },
];
const confirmations = (): StoredConfirmation[] => [
  { key: "k1", batchId: 9, userId: U, status: 200, orderLineId: 1 },
  { key: "k2", batchId: 9, userId: U, status: 200, orderLineId: 2 },
  { key: "k3", batchId: 9, userId: U, status: 422, orderLineId: null },
  { key: "k4", batchId: 9, userId: U, status: 200, orderLineId: 3 },
];
const lines = (): StoredPickLine[] => [
  { batchId: 9, orderLineId: 1, quantity: 2, pickStatus: "picked", pickedQty: 2, confirmedBy: U },
  { batchId: 9, orderLineId: 2, quantity: 1, pickStatus: "short", pickedQty: 0, confirmedBy: U },
  { batchId: 9, orderLineId: 3, quantity: 1, pickStatus: "picked", pickedQty: 1, confirmedBy: U },
  { batchId: 9, orderLineId: 4, quantity: 3, pickStatus: "open", pickedQty: null, confirmedBy: null },
];

describe("the check after a load run", () => {
  it("passes a database that holds exactly what the handhelds were told", () => {
    expect(checkLedger(sent(), { confirmations: confirmations(), lines: lines() })).toEqual({
      acknowledged: 3,
      refused: 1,
      unanswered: 0,
      problems: [],
    });
  });

  it("finds an acknowledged key that was not stored", () => {
    const r = checkLedger(sent(), { confirmations: confirmations().filter((c) => c.key !== "k4"), lines: lines() });
    expect(r.problems.join("\n")).toMatch(/acknowledged key k4 is stored 0 times/);
    expect(r.problems.join("\n")).toMatch(/line 3 \(picked\) has 0 stored successes/);
  });

  it("finds a refused confirmation that was stored as a success", () => {
    const c = confirmations().map((x) => (x.key === "k3" ? { ...x, status: 200, orderLineId: 3 } : x));
    const r = checkLedger(sent(), { confirmations: c, lines: lines() });
    expect(r.problems.join("\n")).toMatch(/refused key k3 .* is stored as 200/);
    expect(r.problems.join("\n")).toMatch(/line 3 \(picked\) has 2 stored successes/);
  });

  it("finds a quantity counted twice and a line changed without an acknowledgement", () => {
    const l = lines().map((x) =>
      x.orderLineId === 1
        ? { ...x, pickedQty: 4 }
        : x.orderLineId === 4
          ? { ...x, pickStatus: "picked" as const, pickedQty: 3, confirmedBy: U }
          : x,
    );
    const r = checkLedger(sent(), { confirmations: confirmations(), lines: l }).problems.join("\n");
    expect(r).toMatch(/line 1 holds picked 4 .* acknowledged picked 2/);
    expect(r).toMatch(/line 4 \(picked\) has 0 stored successes/);
    expect(r).toMatch(/lines hold 8 units picked; handhelds were told 3/);
  });

  it("finds two acknowledged keys for one line and a stored key no handheld sent", () => {
    const s = [
      ...sent(),
      { key: "k5", batchId: 9, orderLineId: 1, userId: U, quantity: 2, short: false, statuses: [200] },
    ];
    const c = [
      ...confirmations(),
      { key: "k5", batchId: 9, userId: U, status: 200, orderLineId: 1 },
      { key: "stray", batchId: 9, userId: U, status: 409, orderLineId: null },
    ];
    const r = checkLedger(s, { confirmations: c, lines: lines() }).problems.join("\n");
    expect(r).toMatch(/line 1 was acknowledged twice \(keys k1 and k5\)/);
    expect(r).toMatch(/stored key stray was never sent/);
  });

  it("counts keys never answered apart and accepts them stored at most once", () => {
    const s = [
      ...sent(),
      { key: "k6", batchId: 9, orderLineId: 4, userId: U, quantity: 3, short: false, statuses: [] },
    ];
    const r = checkLedger(s, { confirmations: confirmations(), lines: lines() });
    expect(r.unanswered).toBe(1);
    expect(r.problems).toEqual([]);
  });
});
