// The check after a load run: what the handhelds were told against what the database holds. Pure, so
// a unit test can feed it a ledger and tables with the faults it must catch.
import type { StoredConfirmation, StoredPickLine } from "../../db/picking-ledger";

export type SentConfirmation = {
  key: string;
  batchId: number;
  orderLineId: number;
  userId: string;
  quantity: number;
  short: boolean;
  statuses: number[];
};

export type CheckResult = {
  acknowledged: number;
  refused: number;
  unanswered: number;
  problems: string[];
};

const MAX_LISTED = 20;

/**
 * Every acknowledged key (answered 200) is stored once, as a success, for its line, and that line holds
 * its quantity; every refused key (only 4xx answers) is stored at most as that refusal and changed no
 * line; every line picked or short in these batches has exactly one acknowledged confirmation, and an
 * open line has none; the quantities picked add up to what was acknowledged, so nothing counts twice.
 */
export function checkLedger(
  sent: Iterable<SentConfirmation>,
  stored: { confirmations: StoredConfirmation[]; lines: StoredPickLine[] },
): CheckResult {
  const problems: string[] = [];
  const problem = (s: string) => {
    if (problems.length < MAX_LISTED) problems.push(s);
    else if (problems.length === MAX_LISTED) problems.push("… and more");
  };
  const rowsByKey = new Map<string, StoredConfirmation[]>();
  for (const c of stored.confirmations) rowsByKey.set(c.key, [...(rowsByKey.get(c.key) ?? []), c]);
  const lineById = new Map(stored.lines.map((l) => [l.orderLineId, l]));
  const successesByLine = new Map<number, string[]>();
  for (const c of stored.confirmations)
    if (c.status === 200 && c.orderLineId !== null)
      successesByLine.set(c.orderLineId, [...(successesByLine.get(c.orderLineId) ?? []), c.key]);

  let acknowledged = 0;
  let refused = 0;
  let unanswered = 0;
  let ackQuantity = 0;
  const ackByLine = new Map<number, string>();
  const sentKeys = new Set<string>();
  for (const s of sent) {
    sentKeys.add(s.key);
    const rows = rowsByKey.get(s.key) ?? [];
    if (s.statuses.length === 0 || s.statuses.every((x) => x >= 500)) {
      unanswered++;
      if (rows.length > 1) problem(`key ${s.key} (never answered) is stored ${rows.length} times`);
      continue;
    }
    if (s.statuses.includes(200)) {
      acknowledged++;
      ackQuantity += s.quantity;
      if (s.statuses.some((x) => x !== 200 && x < 500))
        problem(`key ${s.key} was answered both 200 and ${s.statuses.filter((x) => x !== 200).join(", ")}`);
      if (rows.length !== 1) {
        problem(`acknowledged key ${s.key} is stored ${rows.length} times, not once`);
        continue;
      }
      const row = rows[0]!;
      if (
        row.status !== 200 ||
        row.orderLineId !== s.orderLineId ||
        row.userId !== s.userId ||
        row.batchId !== s.batchId
      )
        problem(`acknowledged key ${s.key} is stored as ${JSON.stringify(row)}`);
      const other = ackByLine.get(s.orderLineId);
      if (other) problem(`line ${s.orderLineId} was acknowledged twice (keys ${other} and ${s.key})`);
      ackByLine.set(s.orderLineId, s.key);
      const line = lineById.get(s.orderLineId);
      const want = s.short ? "short" : "picked";
      if (!line) problem(`acknowledged line ${s.orderLineId} is not in the checked batches`);
      else if (line.pickStatus !== want || line.pickedQty !== s.quantity || line.confirmedBy !== s.userId) {
        problem(
          `line ${s.orderLineId} holds ${line.pickStatus} ${line.pickedQty} by ${line.confirmedBy}; acknowledged ${want} ${s.quantity} by ${s.userId}`,
        );
      }
    } else {
      refused++;
      for (const row of rows)
        if (row.status === 200 || !s.statuses.includes(row.status))
          problem(`refused key ${s.key} (answered ${s.statuses.join(", ")}) is stored as ${row.status}`);
      if (rows.length > 1) problem(`refused key ${s.key} is stored ${rows.length} times`);
    }
  }

  for (const c of stored.confirmations)
    if (!sentKeys.has(c.key)) problem(`stored key ${c.key} was never sent by a handheld`);
  let storedQuantity = 0;
  for (const l of stored.lines) {
    const successes = successesByLine.get(l.orderLineId) ?? [];
    if (l.pickStatus === "open") {
      if (successes.length) problem(`open line ${l.orderLineId} has stored successes ${successes.join(", ")}`);
      continue;
    }
    storedQuantity += l.pickedQty ?? 0;
    if (successes.length !== 1)
      problem(`line ${l.orderLineId} (${l.pickStatus}) has ${successes.length} stored successes, not one`);
    else if (!ackByLine.has(l.orderLineId))
      problem(`line ${l.orderLineId} (${l.pickStatus}) was never acknowledged to a handheld`);
  }
  if (storedQuantity !== ackQuantity)
    problem(`lines hold ${storedQuantity} units picked; handhelds were told ${ackQuantity}`);
  return { acknowledged, refused, unanswered, problems };
}
