// Long work followed by the browser through GET /api/jobs/[id]. Types only.

export type JobStatus = "queued" | "running" | "done" | "failed" | "cancelled";

export type JobDTO = {
  id: string;
  kind: string;
  status: JobStatus;
  progress: number;
  message: string;
  result: unknown;
  createdAt: string;
  updatedAt: string;
};
