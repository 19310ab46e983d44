import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { releaseWaveBy } from "@/lib/waves/wave-actions";

const Release = z.object({ version: rowVersion() });

export const POST = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave") }), body: Release },
  async ({ user, params, body, ip }) => Response.json({ wave: await releaseWaveBy(user, params.id, body.version, ip) }),
);
