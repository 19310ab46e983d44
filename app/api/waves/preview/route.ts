import { z } from "zod";
import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { previewWave } from "@/db/waves";
import { getLayoutVersionById } from "@/db/layout-versions";

// The same filter the new-wave form sends to POST /api/waves, as query parameters.
const Query = z.object({
  layoutVersionId: z
    .string()
    .regex(/^[1-9]\d{0,8}$/, "Choose the layout version from the list.")
    .transform(Number),
  cutoffBefore: z.iso
    .datetime({ offset: true, error: "Give the cut-off as a date and time, or leave it empty." })
    .optional(),
  priorities: z
    .string()
    .regex(/^[1-3](,[1-3]){0,2}$/, "Priorities are 1, 2 or 3, separated by commas.")
    .transform((s) => [...new Set(s.split(",").map(Number))])
    .optional(),
  includeNoCutoff: z
    .enum(["0", "1"], { error: "includeNoCutoff is 1 (take orders without a cut-off) or 0." })
    .optional(),
});

export const GET = route({ access: "waves.plan" }, async ({ user, req }) => {
  const search = new URL(req.url).searchParams;
  const parsed = Query.safeParse({
    layoutVersionId: search.get("layoutVersionId") ?? undefined,
    cutoffBefore: search.get("cutoffBefore") ?? undefined,
    priorities: search.get("priorities") ?? undefined,
    includeNoCutoff: search.get("includeNoCutoff") ?? undefined,
  });
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    throw new HttpError(
      400,
      issue.code === "invalid_type" ? "Choose the layout version from the list." : issue.message,
    );
  }
  const q = parsed.data;
  const version = await getLayoutVersionById(user.siteId, q.layoutVersionId);
  if (!version) throw new HttpError(404, "No such layout version at this site. Choose one from the list.");
  return Response.json(
    await previewWave(user.siteId, version.id, {
      cutoffBefore: q.cutoffBefore ? new Date(q.cutoffBefore) : undefined,
      priorities: q.priorities,
      includeNoCutoff: q.includeNoCutoff === "1",
    }),
  );
});
