import "server-only";
import type { z } from "zod";
import { SESSION_COOKIE } from "@/lib/auth/lucia";
import { validateSessionId, type SignedInUser } from "@/lib/auth/session";
import { roleMay, type Access } from "@/lib/auth/permissions";
import { audit } from "@/db/audit";
import { auditNoSession } from "@/lib/auth/refusals";
import { clientIp } from "./client-ip";
import { originAllowed } from "./origin";
import { fieldsNeedAttention, HttpError, jsonError } from "./errors";
import { zodIssues } from "./zod-issues";
import { databaseOutage, databaseOutageResponse } from "./db-errors";
import { readBodyCapped } from "./read-body";

const MAX_JSON_BYTES = 256 * 1024;

type Params = Record<string, string | string[] | undefined>;

export type RouteContext<B, A extends Access, P = Params> = {
  req: Request;
  ip: string;
  params: P;
  body: B;
  user: A extends "public" ? SignedInUser | null : SignedInUser;
  sessionId: string | null;
};

type Options<S extends z.ZodType | undefined, A extends Access, P extends z.ZodType | undefined> = {
  access: A;
  body?: S;
  params?: P;
};

function readCookie(req: Request, name: string): string | null {
  const header = req.headers.get("cookie");
  if (!header) return null;
  for (const part of header.split(";")) {
    const [k, ...v] = part.trim().split("=");
    if (k === name) return decodeURIComponent(v.join("="));
  }
  return null;
}

async function readJson(req: Request): Promise<unknown> {
  const bytes = await readBodyCapped(req, MAX_JSON_BYTES, `The request is larger than ${MAX_JSON_BYTES / 1024} KiB.`);
  const text = new TextDecoder().decode(bytes);
  if (text.trim() === "") return undefined;
  // A form or text body posted from elsewhere is not what our pages send; refusing it keeps the one
  // parser (and its limits) the only way in.
  const type = req.headers.get("content-type") ?? "";
  if (!/^application\/json\s*(;|$)/i.test(type))
    throw new HttpError(415, "Send this request as JSON (Content-Type: application/json).");
  try {
    return JSON.parse(text);
  } catch {
    throw new HttpError(400, "The request body is not valid JSON.");
  }
}

// No handler needs `export const dynamic = "force-dynamic"`: every one reads the request's headers
// here (client address, cookie), which makes Next render it per request (ƒ in next build's table).

/**
 * Every route handler goes through here, in this order: Origin (for state changes), session, permission,
 * body validation, then the handler. Any step that fails answers with a JSON error a person can read.
 */
export function route<
  A extends Access,
  S extends z.ZodType | undefined = undefined,
  P extends z.ZodType | undefined = undefined,
>(
  opts: Options<S, A, P>,
  handler: (
    ctx: RouteContext<S extends z.ZodType ? z.infer<S> : undefined, A, P extends z.ZodType ? z.output<P> : Params>,
  ) => Promise<Response>,
) {
  return async (req: Request, context: { params: Promise<Params> }): Promise<Response> => {
    const ip = clientIp(req.headers);
    const path = new URL(req.url).pathname;
    try {
      if (!originAllowed(req.method, req.headers)) {
        await audit({
          event: "origin.refused",
          subject: path,
          ip,
          detail: { method: req.method, origin: req.headers.get("origin") },
        });
        return jsonError(
          403,
          "This request did not come from a Trailbin page (missing or foreign Origin). Reload the page and try again.",
        );
      }
      const sessionId = readCookie(req, SESSION_COOKIE);
      const signedIn = sessionId ? await validateSessionId(sessionId) : null;
      const user = signedIn?.user ?? null;
      if (opts.access !== "public") {
        if (!user) {
          await auditNoSession(sessionId, `${req.method} ${path}`, ip);
          return jsonError(401, "Your session has ended or you are not signed in. Sign in and try again.");
        }
        if (!roleMay(user.role, opts.access)) {
          await audit({
            event: "access.denied",
            actorUserId: user.id,
            subject: `${req.method} ${path}`,
            ip,
            detail: { access: opts.access },
          });
          return jsonError(403, "Your role does not allow this. Ask a layout admin if you need access.");
        }
      }
      let body: unknown = undefined;
      if (opts.body) {
        const parsed = opts.body.safeParse(await readJson(req));
        if (!parsed.success) {
          throw fieldsNeedAttention(zodIssues(parsed.error));
        }
        body = parsed.data;
      }
      let params: unknown = (await context.params) ?? {};
      if (opts.params) {
        // A URL param that names nothing (a mangled link) is a 404, after the body's 400s as before.
        const parsed = opts.params.safeParse(params);
        if (!parsed.success)
          throw new HttpError(404, parsed.error.issues[0]?.message ?? "Nothing is at this address. Check the link.");
        params = parsed.data;
      }
      return await handler({
        req,
        ip,
        params: params as P extends z.ZodType ? z.output<P> : Params,
        body: body as S extends z.ZodType ? z.infer<S> : undefined,
        user: user as RouteContext<unknown, A>["user"],
        sessionId: signedIn ? sessionId : null,
      });
    } catch (e) {
      if (e instanceof HttpError) return jsonError(e.status, e.message, e.extra);
      const outage = databaseOutage(e);
      if (outage) {
        console.warn(`${req.method} ${path}: database ${outage}: ${(e as Error).message}`);
        return databaseOutageResponse(outage);
      }
      const ref = crypto.randomUUID().slice(0, 8);
      console.error(`[${ref}] ${req.method} ${path}`, e);
      return jsonError(
        500,
        `Something went wrong on the server (reference ${ref}). Try again; if it keeps happening, tell your admin the reference.`,
      );
    }
  };
}
