import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { idParam } from "@/lib/http/params";
import { uploadedFile } from "@/lib/http/upload";
import { getFloorPlan } from "@/db/floor-plans";
import { recordUpload } from "@/db/uploads";
import { imageType, storeFile } from "@/lib/uploads/store";

const MAX_IMAGE_BYTES = 8 * 1024 * 1024;

export const POST = route(
  { access: "floorplans.edit", params: z.object({ id: idParam("floor plan") }) },
  async ({ user, params, req }) => {
    const plan = await getFloorPlan(user.siteId, params.id);
    if (!plan) throw new HttpError(404, "No such floor plan at this site.");
    const bytes = await uploadedFile(req, MAX_IMAGE_BYTES, "floor-plan picture");
    const mime = imageType(bytes);
    if (!mime) throw new HttpError(415, "The picture must be a PNG or JPEG image.");
    const fileId = await storeFile(bytes);
    await recordUpload({
      id: fileId,
      siteId: user.siteId,
      userId: user.id,
      purpose: "floor-background",
      mime,
      bytes: bytes.length,
    });
    return Response.json({ fileId }, { status: 201 });
  },
);
