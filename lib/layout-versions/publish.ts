import "server-only";
import { createOrJoinJob, updateJob } from "@/db/jobs";
import type { JobDTO } from "@/lib/contracts/jobs";
import { ownJobOrConflict } from "@/lib/jobs/join";
import { cancellable, finished, finishJobIn, JobNoLongerRunning } from "@/lib/jobs/cancel";
import { getDraft } from "@/db/floor-plans";
import { AlreadyPublishedError, insertLayoutVersion } from "@/db/layout-versions";
import { audit } from "@/db/audit";
import { HttpError } from "@/lib/http/errors";
import { checkDocument } from "@/lib/floor-plan/checks";
import type { SignedInUser } from "@/lib/auth/session";
import { computeLayout } from "./compute";
import { rackRunOfBins } from "./build";
import { publishFailureMessage } from "./publish-failure";

export type PublishResult = { layoutVersionId: number; number: number };

/**
 * Starts publishing the draft as saved at `draftVersion` and returns its job at once; the browser
 * polls the job. A second request by the same admin for the same saved draft joins the same job;
 * another admin's gets 409.
 */
export async function startPublish(user: SignedInUser, floorPlanId: number, draftVersion: number, ip: string): Promise<JobDTO> {
  const draft = await getDraft(user.siteId, floorPlanId);
  if (!draft) throw new HttpError(404, "No such floor plan at this site.");
  if (draft.version !== draftVersion) {
    throw new HttpError(409, `The draft was saved again since you loaded it (now save ${draft.version}${draft.updatedByName ? `, by ${draft.updatedByName}` : ""}). Reload it, check it, then publish.`);
  }
  const errors = checkDocument(draft.document).filter((p) => p.severity === "error");
  if (errors.length > 0) {
    throw new HttpError(422, `This draft has ${errors.length} problem${errors.length === 1 ? "" : "s"} to fix before it can be published.`, { problems: errors });
  }
  const start = await createOrJoinJob(user.siteId, "publish-layout", `publish:${floorPlanId}@${draftVersion}`, user.id, "Waiting to start");
  const job = ownJobOrConflict(start, user.id, (by, j) =>
    j.status === "done"
      ? `${by} has already published this save of the draft. Reload the floor plan to see the new version.`
      : `${by} is publishing this save of the draft right now. Wait a moment, then reload the floor plan to see the new version.`,
  );
  if (start.created) {
    await audit({ event: "layout.publish_started", actorUserId: user.id, subject: `floor-plan:${floorPlanId}`, ip, detail: { draftVersion, job: job.id } });
    void runPublish(job.id, floorPlanId, draftVersion, user);
  }
  return job;
}

async function runPublish(jobId: string, floorPlanId: number, draftVersion: number, user: SignedInUser): Promise<void> {
  let lastWrite = 0;
  const progress = (fraction: number, message: string) => {
    // Progress comes from the worker many times a second; the database needs a few writes at most.
    const now = Date.now();
    if (now - lastWrite < 250 && fraction < 1) return;
    lastWrite = now;
    void updateJob(jobId, { status: "running", progress: fraction, message }).catch(() => undefined);
  };
  const signal = cancellable(jobId);
  try {
    // Cancelled while it waited to start.
    if (!(await updateJob(jobId, { status: "running", progress: 0, message: "Reading the draft" }))) return;
    const draft = await getDraft(user.siteId, floorPlanId);
    if (!draft || draft.version !== draftVersion) throw new HttpError(409, "The draft changed while publishing started. Reload it and publish again.");
    const { graph, matrix } = await computeLayout(draft.document, (f, stage) => progress(0.05 + f * 0.8, stage));
    if (signal.aborted) return;
    progress(0.9, `Storing ${graph.nodes.length} junctions, ${graph.edges.length} corridors and ${graph.bins.length} bins`);
    const stored = await insertLayoutVersion(
      { floorPlanId, fromDraftVersion: draftVersion, document: draft.document, graph, matrix, rackRunOfBin: rackRunOfBins(draft.document), userId: user.id },
      (trx, v) => finishJobIn(trx, jobId, { message: `Published as version ${v.number}`, result: { layoutVersionId: v.id, number: v.number } }),
    );
    await audit({ event: "layout.published", actorUserId: user.id, subject: `floor-plan:${floorPlanId}`, detail: { version: stored.number, bins: graph.bins.length } });
  } catch (e) {
    if (e instanceof JobNoLongerRunning) return;
    if (e instanceof AlreadyPublishedError) {
      await updateJob(jobId, { status: "done", progress: 1, message: `Already published as version ${e.existing.number}`, result: { layoutVersionId: e.existing.id, number: e.existing.number } });
      return;
    }
    console.error(`publish job ${jobId} failed`, e);
    await updateJob(jobId, { status: "failed", message: publishFailureMessage(e, jobId) }).catch(() => undefined);
  } finally {
    finished(jobId);
  }
}
