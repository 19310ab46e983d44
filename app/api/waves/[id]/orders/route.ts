import { z } from "zod";
import { route } from "@/lib/http/route";
import { idParam } from "@/lib/http/params";
import { WaveOrdersBody } from "@/lib/waves/control-schemas";
import { changeWaveOrdersBy, waveOrders } from "@/lib/waves/wave-control";

const Params = z.object({ id: idParam("wave") });

export const GET = route({ access: "waves.plan", params: Params }, async ({ user, params }) =>
  Response.json(await waveOrders(user, params.id)),
);

export const POST = route(
  { access: "waves.plan", params: Params, body: WaveOrdersBody },
  async ({ user, params, body, ip }) => Response.json(await changeWaveOrdersBy(user, params.id, body, ip)),
);
