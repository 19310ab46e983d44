import { describe, expect, it } from "vitest";
import { api, signInAs } from "../support/app";
import { concrete, discoverRoutes } from "../support/app-routes";
import { latestAudit } from "@/db/audit";

const mutations = discoverRoutes().handlers.flatMap((h) =>
  h.methods.filter((m) => m !== "GET").map((method) => ({ url: h.url, method })),
);

describe("state-changing requests must come from our own origin", () => {
  it("there are mutating routes to check", () => expect(mutations.length).toBeGreaterThan(0));

  for (const variant of [
    { name: "missing Origin", origin: undefined },
    { name: "foreign Origin", origin: "https://attacker.example" },
    { name: "look-alike Origin", origin: "http://127.0.0.1.attacker.example" },
  ]) {
    it.each(mutations)(`${variant.name}: $method $url → 403`, async ({ url, method }) => {
      const cookie = await signInAs("admin");
      let req = api()[method.toLowerCase() as "post"](concrete(url)).set("Cookie", cookie);
      if (variant.origin) req = req.set("Origin", variant.origin);
      const res = await req.send({ email: "admin@bramblegate.example", password: "x", role: "planner", version: 1 });
      expect(res.status).toBe(403);
      expect(res.body.error).toMatch(/Origin/);
      const [last] = await latestAudit(1, "origin.refused");
      expect(last?.subject).toBe(concrete(url));
    });
  }
});
