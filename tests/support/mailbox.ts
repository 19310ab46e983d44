import { sinkMessagesTo } from "@/db/mail-sink";
import type { SinkMessage } from "@/lib/contracts/mail";

/** The sink stores what it receives in the database; poll it, as a person would refresh a mailbox. */
export async function waitForMail(address: string, count = 1, timeoutMs = 10_000): Promise<SinkMessage[]> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await sinkMessagesTo(address);
    if (found.length >= count) return found;
    if (Date.now() > until) throw new Error(`no mail for ${address} within ${timeoutMs} ms (found ${found.length})`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

export function linkIn(text: string | null): string {
  const m = (text ?? "").match(/https?:\/\/\S+\/set-password\?token=[A-Za-z0-9_-]+/);
  if (!m) throw new Error(`no set-password link in: ${text}`);
  return m[0];
}

export const tokenOf = (link: string) => new URL(link).searchParams.get("token")!;

let n = 0;
export const uniqueAddress = (what: string) => `${what}-${Date.now()}-${process.pid}-${++n}@tests.example`;
