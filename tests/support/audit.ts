import { latestAudit, type AuditEvent } from "@/db/audit";

/** The newest audit entry id now, so a test can ask what was logged after it. */
export async function auditMark(): Promise<number> {
  const [last] = await latestAudit(1);
  return last?.id ?? 0;
}

/** Entries of `event` logged after `mark`, oldest first. */
export async function auditedSince(mark: number, event: AuditEvent) {
  return (await latestAudit(50, event)).filter((e) => e.id > mark).reverse();
}
