import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { getOrderDetail } from "@/db/orders";

export const GET = route(
  { access: "waves.read", params: z.object({ id: idParam("order") }) },
  async ({ user, params }) => {
    const order = await getOrderDetail(user.siteId, params.id);
    if (!order) throw new HttpError(404, "No such order at this site. Check the link or go back to the orders list.");
    return Response.json({ order });
  },
);
