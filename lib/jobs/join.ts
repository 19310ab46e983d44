import "server-only";
import type { JobStart } from "@/db/jobs";
import type { JobDTO } from "@/lib/contracts/jobs";
import { HttpError } from "@/lib/http/errors";

/**
 * The same person asking again (a double click, a retry on flaky Wi-Fi) joins their own job. Someone
 * else asking for the same work while it runs, or after it is done, did not win: they get 409 and
 * learn who did, instead of silently riding on a job they did not start.
 */
export function ownJobOrConflict(start: JobStart, userId: string, refusal: (by: string, job: JobDTO) => string): JobDTO {
  if (start.created || !start.startedBy || start.startedBy.id === userId) return start.job;
  throw new HttpError(409, refusal(start.startedBy.name, start.job), { jobId: start.job.id, startedBy: start.startedBy.name });
}
