import { afterAll, describe, expect, it } from "vitest";
import { api, makeUser, ORIGIN } from "../support/app";
import { testService } from "../support/test-services";
import { closeDb } from "@/db/knex";
import { listOutbox } from "@/db/outbox";
import type { OutboxRow } from "@/lib/contracts/mail";
import { sinkMessagesTo } from "@/db/mail-sink";
import { FIRST_RETRY_MS } from "@/lib/mail/backoff";

// mail.test.ts drives the sender in the test process against a closed port; this one takes the
// running SMTP sink itself down and lets the running server's own outbox sender find out.

afterAll(async () => {
  // Whatever happened above, the next test files need the sink.
  await testService("mail-sink", "start").catch(() => undefined);
  await closeDb();
});

async function outboxRowTo(address: string): Promise<OutboxRow | undefined> {
  return (await listOutbox(200)).find((m) => m.to === address);
}

async function waitFor<T>(what: string, timeoutMs: number, probe: () => Promise<T | undefined | false>): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await probe();
    if (v) return v;
    if (Date.now() > until) throw new Error(`${what} did not happen within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

describe("the SMTP server down", () => {
  it("a password reset mail waits in the outbox while the sink is down and is delivered once when it is back", async () => {
    const u = await makeUser("picker");
    await testService("mail-sink", "stop");
    try {
      const res = await api().post("/api/password/reset-request").set("Origin", ORIGIN).send({ email: u.email });
      expect(res.status).toBe(200);

      // The server's sender (a tick a second) tried, failed, and keeps the message for later.
      const failed = await waitFor("a failed send attempt", 15_000, async () => {
        const row = await outboxRowTo(u.email);
        return row && row.attempts >= 1 && row;
      });
      expect(failed.status).toBe("pending");
      expect(failed.lastError).toMatch(/ECONNREFUSED|connect/i);
      expect(new Date(failed.nextAttemptAt).getTime()).toBeGreaterThan(new Date(failed.createdAt).getTime());
      expect(await sinkMessagesTo(u.email)).toEqual([]);
    } finally {
      await testService("mail-sink", "start");
    }

    // The next try after the backoff (FIRST_RETRY_MS after the failure) reaches the sink.
    const [mail] = await waitFor("delivery after the sink came back", FIRST_RETRY_MS * 4, async () => {
      const got = await sinkMessagesTo(u.email);
      return got.length > 0 && got;
    });
    expect(mail!.subject).toBe("Reset your Trailbin password");
    // The sink holds the mail a moment before the sender records the delivery on its row.
    const sent = await waitFor("the outbox row to record the delivery", 10_000, async () => {
      const row = await outboxRowTo(u.email);
      return row && row.status !== "sending" && row;
    });
    expect(sent.status).toBe("sent");
    expect(sent.attempts).toBeGreaterThanOrEqual(2);
    // Several more ticks of the sender: still one copy.
    await new Promise((r) => setTimeout(r, 3000));
    expect(await sinkMessagesTo(u.email)).toHaveLength(1);
    expect((await outboxRowTo(u.email))!.status).toBe("sent");
  }, 120_000);
});
