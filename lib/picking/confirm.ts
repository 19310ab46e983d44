import "server-only";
import { createHash } from "node:crypto";
import { confirmLine, type ConfirmOutcome } from "@/db/picking";
import { appOrigin } from "@/lib/mail/config";
import { judgeConfirmation, type ConfirmRequest } from "./rules";

export type ConfirmBody = ConfirmRequest & { idempotencyKey: string; orderLineId: number };

/** The fingerprint of what a key was first used for: the same key with another body is refused. */
export function requestSha256(batchId: number, b: ConfirmBody): string {
  const canonical = JSON.stringify([
    batchId,
    b.orderLineId,
    b.scan?.trim() ?? null,
    b.quantity,
    b.short?.reason ?? null,
    b.binCode.trim().toUpperCase(),
    b.batchVersion,
  ]);
  return createHash("sha256").update(canonical).digest("hex");
}

/** Confirms one line; a pick that is stored is audited in the same transaction, with the sender's address. */
export async function confirmPick(
  batchId: number,
  userId: string,
  b: ConfirmBody,
  ip: string | null,
): Promise<ConfirmOutcome> {
  return confirmLine(
    {
      batchId,
      userId,
      key: b.idempotencyKey,
      requestSha256: requestSha256(batchId, b),
      orderLineId: b.orderLineId,
      scan: b.scan,
      quantity: b.quantity,
      short: b.short,
      mailOrigin: appOrigin(),
    },
    (line, batch) => {
      const v = judgeConfirmation(line, batch, b);
      const body: Record<string, unknown> = v.error
        ? { error: v.error }
        : {
            line: {
              orderLineId: b.orderLineId,
              pickStatus: v.apply!.status,
              pickedQty: v.apply!.pickedQty,
              shortReason: v.apply!.shortReason,
            },
          };
      return { answer: { status: v.status, body }, apply: v.apply };
    },
    { ip },
  );
}
