import "server-only";
import { handoversTo } from "@/db/shift-floor";
import type { MyBatchDTO } from "@/lib/contracts/picking";

/** My batches says which of them a supervisor assigned or moved to the picker, and who. */
export async function withAssigners(userId: string, batches: MyBatchDTO[]): Promise<MyBatchDTO[]> {
  const given = await handoversTo(
    userId,
    batches.map((b) => b.id),
  );
  return batches.map((b) => {
    const h = given.get(b.id);
    return { ...b, assignedBy: h ? { name: h.byName ?? "your supervisor", at: h.at } : null };
  });
}
