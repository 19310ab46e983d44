import { HttpError } from "@/lib/http/errors";

/**
 * The words a failed publish job shows the admin. Only messages written for a person (HttpError) are
 * passed on: a database or driver error carries SQL, table and column names, and a worker's error
 * engine internals, none of which the admin can act on, so those stay in the server log.
 */
export function publishFailureMessage(e: unknown, jobId: string): string {
  if (e instanceof HttpError) return `Publishing failed: ${e.message}`;
  return `Publishing failed on the server, and the draft is unchanged. Try again in a minute; if it fails again, tell your system administrator (job ${jobId}).`;
}
