import { route } from "@/lib/http/route";
import { floorView } from "@/lib/shift/floor-view";

export const GET = route({ access: "floor.watch" }, async ({ user }) => Response.json(await floorView(user.siteId)));
