import { expect } from "vitest";
import { api, ORIGIN, makeUser, signIn } from "./app";

/** Follows a job through GET /api/jobs/[id] until it is done, failed or cancelled (at most a minute). */
export async function waitForJob(cookie: string, jobId: string) {
  for (let i = 0; i < 600; i++) {
    const res = await api().get(`/api/jobs/${jobId}`).set("Cookie", cookie);
    if (["done", "failed", "cancelled"].includes(res.body.job?.status)) return res.body.job;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error("job did not finish");
}

/** A fresh picker who took the next released batch nobody held. */
export async function pickerWithBatch() {
  const u = await makeUser("picker");
  const cookie = await signIn(u.email, u.password);
  const next = (await api().get("/api/my-batches").set("Cookie", cookie)).body.next;
  expect(next, "a released batch nobody holds").toBeTruthy();
  const take = await api()
    .post(`/api/batches/${next.id}/take`)
    .set("Cookie", cookie)
    .set("Origin", ORIGIN)
    .send({ version: next.version });
  expect(take.status, JSON.stringify(take.body)).toBe(200);
  return { user: u, cookie, batchId: next.id as number };
}
