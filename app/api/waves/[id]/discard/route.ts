import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { rowVersion } from "@/lib/http/body-fields";
import { discardWaveBy } from "@/lib/waves/wave-actions";

const Discard = z.object({ version: rowVersion() });

export const POST = route(
  { access: "waves.plan", params: z.object({ id: idParam("wave") }), body: Discard },
  async ({ user, params, body, ip }) => {
    const { orders } = await discardWaveBy(user, params.id, body.version, ip);
    return Response.json({ discarded: true, orders });
  },
);
