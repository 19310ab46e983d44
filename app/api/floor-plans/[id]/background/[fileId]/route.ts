import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { textParam } from "@/lib/http/params";
import { getUpload } from "@/db/uploads";
import { readStoredFile } from "@/lib/uploads/store";

export const GET = route(
  { access: "floorplans.read", params: z.object({ fileId: textParam() }) },
  async ({ user, params }) => {
    const upload = await getUpload(user.siteId, params.fileId);
    const bytes = upload?.purpose === "floor-background" ? await readStoredFile(upload.id) : null;
    if (!upload || !bytes) throw new HttpError(404, "That picture is not stored here any more. Upload it again.");
    return new Response(new Uint8Array(bytes), {
      headers: {
        "content-type": upload.mime,
        "cache-control": "private, max-age=31536000, immutable",
        "x-content-type-options": "nosniff",
      },
    });
  },
);
