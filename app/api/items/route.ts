import { route } from "@/lib/http/route";
import { listItems } from "@/db/items";

export const GET = route({ access: "waves.read" }, async ({ user }) =>
  Response.json({ items: await listItems(user.siteId) }),
);
