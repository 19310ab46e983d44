import { route } from "@/lib/http/route";
import { HttpError } from "@/lib/http/errors";
import { getSite, updateSite } from "@/db/sites";
import { differingFields, SiteChangeBody } from "@/lib/site/site-body";

// Planners and supervisors read the figures their estimates use; only an admin changes them.
export const GET = route({ access: "waves.read" }, async ({ user }) => {
  const site = await getSite(user.siteId);
  if (!site) throw new HttpError(404, "Your site is not set up. Ask the person who installed Trailbin.");
  return Response.json({ site });
});

export const PATCH = route({ access: "site.manage", body: SiteChangeBody }, async ({ user, body, ip }) => {
  const { version, ...change } = body;
  const saved = await updateSite(user.siteId, version, change, { userId: user.id, ip });
  if (!saved.ok && saved.reason === "missing")
    throw new HttpError(404, "Your site is not set up. Ask the person who installed Trailbin.");
  if (!saved.ok && saved.reason === "stale") {
    const differs = differingFields(saved.site, change);
    throw new HttpError(
      409,
      "Someone else saved the site settings while you were editing them" +
        (differs.length ? ` (now different from yours: ${differs.join(", ")})` : "") +
        ". Their figures are shown now: check them and save your change again.",
      { site: saved.site },
    );
  }
  return Response.json({ site: saved.ok ? saved.site : null, changed: saved.ok ? saved.changed : [] });
});
