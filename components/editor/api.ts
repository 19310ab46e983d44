import type { EditorDocument, RackRun } from "@/lib/floor-plan/document";
import type { Problem } from "@/lib/floor-plan/checks";
import { postJson, requestJson, uploadFile, type ApiResult } from "@/lib/client/fetch-json";
import type { RowProblem } from "@/lib/contracts/imports";

export type { DraftResponse, SaveConflict } from "@/lib/contracts/floor-plans";
export type BadRow = RowProblem;

export const draftUrl = (planId: number) => `/api/floor-plans/${planId}/draft`;
export const backgroundUrl = (planId: number, fileId: string) => `/api/floor-plans/${planId}/background/${fileId}`;
export const runBinsUrl = (planId: number, runId: string, format: "xlsx" | "csv") =>
  `/api/floor-plans/${planId}/rack-runs/${encodeURIComponent(runId)}/bins?format=${format}`;

export const saveDraft = (planId: number, version: number, document: EditorDocument) =>
  requestJson<{ version: number }>("PUT", draftUrl(planId), { version, document });
export const startPublish = (planId: number, version: number) =>
  postJson<{ jobId: string | number }>(`/api/floor-plans/${planId}/publish`, { version });
export const uploadBackground = (planId: number, file: File) =>
  uploadFile<{ fileId: string }>(`/api/floor-plans/${planId}/background`, file);
export const importRunBins = (planId: number, runId: string, file: File) =>
  uploadFile<{ customCodes: RackRun["customCodes"] }>(
    `/api/floor-plans/${planId}/rack-runs/${encodeURIComponent(runId)}/bins`,
    file,
  );

/** Problems the server found when refusing to publish (422). */
export function publishProblems(r: ApiResult<unknown>): Problem[] {
  if (r.ok || r.status !== 422) return [];
  const body = r.body as { problems?: Problem[] } | null | undefined;
  return Array.isArray(body?.problems) ? body.problems : [];
}
