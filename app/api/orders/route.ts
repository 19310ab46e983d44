import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { listOrders } from "@/db/orders";
import { ORDER_STATUSES } from "@/lib/contracts/orders";

export const dynamic = "force-dynamic";

const statusParam = z.enum([...ORDER_STATUSES, "all"]).default("all");

export const GET = route({ access: "waves.read" }, async ({ user, req }) => {
  const parsed = statusParam.safeParse(new URL(req.url).searchParams.get("status") ?? undefined);
  if (!parsed.success) throw new HttpError(400, `Status must be one of ${[...ORDER_STATUSES, "all"].join(", ")}.`);
  return Response.json({ orders: await listOrders(user.siteId, parsed.data === "all" ? undefined : parsed.data) });
});
