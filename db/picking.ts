import "server-only";
import { db } from "./knex";
import { queueShortPickSummaryIfWaveDone } from "./wave-mail";
import { audit } from "./audit";
import { BATCH_WAVE_COLUMNS, OPEN_STATUSES, shortLinesColumn, toBatchWave } from "./batch-columns";
import { isDuplicateKey, iso, json } from "./rows";
import type { MyBatchDTO, PickBatchRef, PickBatchStatus, PickLineState, PickStatus } from "@/lib/contracts/picking";

/** The batch's row with its wave, as the picking routes need it to decide who may work it. */
export type PickBatchRow = PickBatchRef & {
  assignedTo: string | null;
  assignedName: string | null;
  layoutVersionId: number;
  depotId: string;
  dropoffId: string;
  startedAt: string | null;
  finishedAt: string | null;
};

export async function getPickBatch(siteId: number, batchId: number): Promise<PickBatchRow | null> {
  const r = await db()("batches as b")
    .join("waves as w", "w.id", "b.wave_id")
    .leftJoin("users as u", "u.id", "b.assigned_to")
    .where({ "b.id": batchId, "w.site_id": siteId })
    .first(
      "b.id",
      "b.wave_id",
      "w.name as wave_name",
      "b.number",
      "b.status",
      "b.version",
      "b.assigned_to",
      "u.display_name as assigned_name",
      "w.layout_version_id",
      "w.settings",
      "b.started_at",
      "b.finished_at",
    );
  if (!r) return null;
  const settings = json<{ depotId: string; dropoffId: string }>(r.settings);
  return {
    id: Number(r.id),
    waveId: Number(r.wave_id),
    waveName: r.wave_name,
    number: Number(r.number),
    status: r.status,
    version: Number(r.version),
    assignedTo: r.assigned_to,
    assignedName: r.assigned_name ?? null,
    layoutVersionId: Number(r.layout_version_id),
    depotId: settings.depotId,
    dropoffId: settings.dropoffId,
    startedAt: iso(r.started_at),
    finishedAt: iso(r.finished_at),
  };
}

/** Every line of a batch with its pick state, in walking order (stop, then tote). */
export async function pickLines(batchId: number): Promise<PickLineState[]> {
  const rows = await db()("batch_lines as bl")
    .join("order_lines as l", "l.id", "bl.order_line_id")
    .join("orders as o", "o.id", "l.order_id")
    .join("items as i", "i.id", "l.item_id")
    .where("bl.batch_id", batchId)
    .select(
      "bl.order_line_id",
      "bl.stop_seq",
      "bl.tote",
      "bl.bin_code",
      "bl.pick_status",
      "bl.picked_qty",
      "bl.short_reason",
      "o.order_number",
      "i.sku",
      "i.description",
      "i.uom",
      "i.unit_weight_g",
      "l.quantity",
    )
    .orderBy([{ column: "bl.stop_seq" }, { column: "bl.tote" }, { column: "bl.order_line_id" }]);
  return rows.map((r: Record<string, unknown>) => ({
    orderLineId: Number(r.order_line_id),
    stopSeq: Number(r.stop_seq),
    tote: Number(r.tote),
    binCode: String(r.bin_code),
    orderNumber: String(r.order_number),
    sku: String(r.sku),
    description: String(r.description),
    quantity: Number(r.quantity),
    uom: String(r.uom),
    unitWeightG: Number(r.unit_weight_g),
    pickStatus: r.pick_status as PickLineState["pickStatus"],
    pickedQty: r.picked_qty === null ? null : Number(r.picked_qty),
    shortReason: (r.short_reason as string | null) ?? null,
  }));
}

function batchesWithCounts(siteId: number) {
  return db()("batches as b")
    .join("waves as w", "w.id", "b.wave_id")
    .where("w.site_id", siteId)
    .select(
      ...BATCH_WAVE_COLUMNS,
      db().raw("(select count(*) from batch_stops s where s.batch_id = b.id) as stop_count"),
      db().raw("(select count(*) from batch_lines l where l.batch_id = b.id) as line_count"),
      db().raw("(select count(*) from batch_lines l where l.batch_id = b.id and l.pick_status = 'open') as open_lines"),
      shortLinesColumn(),
    );
}

const toMyBatch = (r: Record<string, unknown>): MyBatchDTO => ({
  ...toBatchWave<PickBatchStatus>(r),
  stopCount: Number(r.stop_count),
  lineCount: Number(r.line_count),
  openLines: Number(r.open_lines),
  shortLines: Number(r.short_lines),
});

/** Batches on this picker's handheld that still have work: the one being picked first, then by wave and number. */
export async function myBatches(siteId: number, userId: string): Promise<MyBatchDTO[]> {
  const rows = await batchesWithCounts(siteId)
    .where("b.assigned_to", userId)
    .whereIn("b.status", ["released", "picking"])
    .orderByRaw("b.status = 'picking' desc, w.released_at, b.wave_id, b.number");
  return rows.map(toMyBatch);
}

/**
 * The batch "Take the next batch" offers: nobody holds it and it has work left. One already started
 * (given back half-picked, or begun by an admin) comes first, so started carts are finished first.
 */
export async function nextUnassignedBatch(siteId: number): Promise<MyBatchDTO | null> {
  const r = await batchesWithCounts(siteId)
    .whereNull("b.assigned_to")
    .whereIn("b.status", OPEN_STATUSES)
    .orderByRaw("b.status = 'picking' desc, w.released_at, b.wave_id, b.number")
    .first();
  return r ? toMyBatch(r) : null;
}

export type TakeOutcome = "taken" | "lost" | "cap";

/**
 * Assigns an unfinished batch nobody holds to the user if it is still at `version`: exactly one taker
 * wins. The taker's user row is locked first, so parallel takes by one picker are counted one after
 * the other and never pass the site's cap together.
 */
export async function takeBatch(
  siteId: number,
  batchId: number,
  version: number,
  userId: string,
  cap: number,
): Promise<TakeOutcome> {
  return db().transaction(async (trx) => {
    await trx("users").where({ id: userId }).forUpdate().first("id");
    const held = await trx("batches")
      .where({ assigned_to: userId })
      .whereIn("status", OPEN_STATUSES)
      .count({ n: "*" })
      .first();
    if (Number(held?.n ?? 0) >= cap) return "cap" as const;
    const n = await trx("batches")
      .where({ id: batchId, version })
      .whereIn("status", OPEN_STATUSES)
      .whereNull("assigned_to")
      .whereIn("wave_id", trx("waves").where({ site_id: siteId }).select("id"))
      .update({ assigned_to: userId, taken_at: trx.fn.now(3), version: version + 1 });
    return Number(n) === 1 ? ("taken" as const) : ("lost" as const);
  });
}

/**
 * Puts an unfinished batch back in the pool, lines already picked staying picked. A picker gives back
 * only their own; `anyHolder` (an admin) may give back anyone's. The version moves on, so confirmations
 * still queued on the old holder's handheld are refused instead of landing on the next holder's batch.
 */
export async function giveBackBatch(
  siteId: number,
  batchId: number,
  version: number,
  userId: string,
  anyHolder: boolean,
): Promise<boolean> {
  const q = db()("batches")
    .where({ id: batchId, version })
    .whereIn("status", OPEN_STATUSES)
    .whereNotNull("assigned_to")
    .whereIn("wave_id", db()("waves").where({ site_id: siteId }).select("id"));
  if (!anyHolder) q.where({ assigned_to: userId });
  return Number(await q.update({ assigned_to: null, taken_at: null, version: version + 1 })) === 1;
}

/** Every unfinished batch a user holds goes back to the pool (when they are disabled or stop being a picker). */
export async function releaseBatchesOf(userId: string): Promise<number> {
  return Number(
    await db()("batches")
      .where({ assigned_to: userId })
      .whereIn("status", OPEN_STATUSES)
      .update({ assigned_to: null, taken_at: null, version: db().raw("version + 1") }),
  );
}

export type StoredAnswer = { status: number; body: Record<string, unknown> };

export type ConfirmInput = {
  batchId: number;
  userId: string;
  key: string;
  requestSha256: string;
  orderLineId: number;
  scan?: string;
  quantity: number;
  short?: { reason: string };
  /** Where the wave's summary mail links to, when this line finishes the wave. */
  mailOrigin: string;
};

export type ConfirmOutcome =
  | { kind: "fresh"; answer: StoredAnswer; event: "pick.confirmed" | "pick.short" | null }
  | { kind: "replay"; answer: StoredAnswer }
  | { kind: "mismatch" };

/**
 * One confirmation in one transaction, in few round trips (each costs more than the SQL behind it).
 * The batch row is locked first, so every confirmation of a batch (a repeat of a key included) waits
 * for the one before it to commit. The key goes in last, with the answer: a repeat does the same
 * checks, finds its key taken, rolls back and gets the stored answer, so whatever the first send
 * answered (success or refusal) is what every repeat gets. Nothing shared between batches is locked
 * (a locking read over the line, order line and item used to lock the item row, so pickers of one SKU
 * on different batches queued behind each other). The line changes only while it is still open, and
 * the audit row of a pick commits with it.
 */
export async function confirmLine(
  input: ConfirmInput,
  decide: (line: PickLineRowForCheck | null, batch: { status: PickBatchStatus; version: number }) => Decision,
  audited: { ip: string | null },
): Promise<ConfirmOutcome> {
  try {
    return await db().transaction(async (trx) => {
      // Locks the batch row and the line's row only: the subqueries are plain reads (InnoDB locks
      // no rows for them), evaluated after the locks are held, so they see every earlier commit.
      const row = await trx("batches as b")
        .leftJoin("batch_lines as bl", (j) =>
          j.on("bl.batch_id", "b.id").andOn("bl.order_line_id", trx.raw("?", [input.orderLineId])),
        )
        .where("b.id", input.batchId)
        .forUpdate()
        .first(
          "b.status",
          "b.version",
          "bl.order_line_id",
          "bl.bin_code",
          "bl.pick_status",
          trx.raw(
            "(select i.sku from order_lines l join items i on i.id = l.item_id where l.id = bl.order_line_id) as sku",
          ),
          trx.raw("(select l.quantity from order_lines l where l.id = bl.order_line_id) as quantity"),
          trx.raw(
            "(select count(*) from batch_lines o where o.batch_id = b.id and o.pick_status = 'open') as open_lines",
          ),
        );
      if (!row) throw new Error(`batch ${input.batchId} vanished while confirming`);
      const status = row.status as PickBatchStatus;
      const d = decide(
        row.order_line_id === null
          ? null
          : {
              orderLineId: Number(row.order_line_id),
              binCode: String(row.bin_code),
              sku: String(row.sku),
              quantity: Number(row.quantity),
              pickStatus: row.pick_status,
            },
        { status, version: Number(row.version) },
      );
      let answer: StoredAnswer = d.answer;
      const event = d.apply
        ? d.apply.status === "short"
          ? ("pick.short" as const)
          : ("pick.confirmed" as const)
        : null;
      if (d.apply) {
        const changed = await trx("batch_lines")
          .where({ batch_id: input.batchId, order_line_id: input.orderLineId, pick_status: "open" })
          .update({
            pick_status: d.apply.status,
            picked_qty: d.apply.pickedQty,
            short_reason: d.apply.shortReason,
            confirmed_at: trx.fn.now(3),
            confirmed_by: input.userId,
          });
        // Never answer success for a change that did not happen.
        if (Number(changed) !== 1)
          throw new Error(`line ${input.orderLineId} of batch ${input.batchId} was no longer open`);
        const open = Number(row.open_lines) - 1;
        const done = open === 0;
        if (done) {
          await trx("batches")
            .where({ id: input.batchId })
            .update({
              status: "done",
              finished_at: trx.fn.now(3),
              ...(status === "released" ? { started_at: trx.fn.now(3) } : {}),
            });
          await queueShortPickSummaryIfWaveDone(trx, input.batchId, input.mailOrigin);
        } else if (status === "released") {
          await trx("batches")
            .where({ id: input.batchId })
            .update({ status: "picking", started_at: trx.fn.now(3) });
        }
        answer = {
          status: 200,
          body: { ...answer.body, batch: { status: done ? "done" : "picking", openLines: open } },
        };
        await audit(
          {
            event: event!,
            actorUserId: input.userId,
            subject: `batch:${input.batchId}`,
            ip: audited.ip,
            detail: { orderLineId: input.orderLineId, quantity: input.quantity, reason: input.short?.reason },
          },
          trx,
        );
      }
      await trx("pick_confirmations").insert({
        idempotency_key: input.key,
        batch_id: input.batchId,
        user_id: input.userId,
        request_sha256: input.requestSha256,
        response: JSON.stringify(answer),
      });
      return { kind: "fresh" as const, answer, event };
    });
  } catch (e) {
    if (!isDuplicateKey(e)) throw e;
    const stored = await db()("pick_confirmations")
      .where({ idempotency_key: input.key })
      .first("user_id", "batch_id", "request_sha256", "response");
    if (!stored) throw e;
    if (
      stored.request_sha256 !== input.requestSha256 ||
      stored.user_id !== input.userId ||
      Number(stored.batch_id) !== input.batchId
    )
      return { kind: "mismatch" };
    return { kind: "replay", answer: json<StoredAnswer>(stored.response) };
  }
}

export type PickLineRowForCheck = {
  orderLineId: number;
  binCode: string;
  sku: string;
  quantity: number;
  pickStatus: PickStatus;
};

export type Decision = {
  answer: StoredAnswer;
  apply?: { status: "picked" | "short"; pickedQty: number; shortReason: string | null };
};
