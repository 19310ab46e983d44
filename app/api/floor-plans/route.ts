import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { createFloorPlan, DuplicateFloorPlanError, listFloorPlans } from "@/db/floor-plans";
import { blankDocument, MAX_SIDE_CELLS } from "@/lib/floor-plan/document";

const NewPlan = z.object({
  name: z.string().trim().min(1, "Give the floor plan a name.").max(120),
  widthM: z.number().positive().max(2000),
  heightM: z.number().positive().max(2000),
  cellMm: z.number().int().min(250, "Cells are at least 250 mm.").max(5000, "Cells are at most 5,000 mm."),
});

export const GET = route({ access: "floorplans.read" }, async ({ user }) =>
  Response.json({ floorPlans: await listFloorPlans(user.siteId) }),
);

export const POST = route({ access: "floorplans.edit", body: NewPlan }, async ({ user, body }) => {
  const width = Math.ceil((body.widthM * 1000) / body.cellMm);
  const height = Math.ceil((body.heightM * 1000) / body.cellMm);
  if (width < 4 || height < 4)
    throw new HttpError(400, "The floor must be at least 4 cells each way; choose smaller cells or a larger floor.");
  if (width > MAX_SIDE_CELLS || height > MAX_SIDE_CELLS) {
    throw new HttpError(
      400,
      `That is ${width} × ${height} cells; the editor takes at most ${MAX_SIDE_CELLS} each way. Choose larger cells.`,
    );
  }
  try {
    const id = await createFloorPlan(user.siteId, body.name, blankDocument(width, height, body.cellMm), user.id);
    return Response.json({ id }, { status: 201 });
  } catch (e) {
    if (e instanceof DuplicateFloorPlanError)
      throw new HttpError(409, `A floor plan called “${body.name}” already exists. Choose another name.`);
    throw e;
  }
});
