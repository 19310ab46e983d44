"use client";

import { FieldErrors } from "@/components/FieldErrors";
import type { SyncNotice } from "./useDraftSync";
import type { SaveConflict } from "./api";
import { PublishProgress } from "./PublishProgress";
import { useDateStyle } from "@/components/SiteFormat";
import { formatDateTime, type DateStyle } from "@/lib/format/dates";

type Props = {
  planId: number;
  dirty: boolean;
  saving: boolean;
  publishing: boolean;
  /** Why publishing is not possible now, or null. */
  publishBlocked: string | null;
  conflict: SaveConflict["current"] | null;
  notice: SyncNotice;
  jobId: string | null;
  onSave: () => void;
  onPublish: () => void;
  onReload: () => void;
  onKeepEditing: () => void;
};

function when(iso: string, style: DateStyle): string {
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? "just now" : formatDateTime(d, style);
}

/** Save and publish, the draft's state, and what the server said. */
export function SaveBar(p: Props) {
  const style = useDateStyle();
  return (
    <div className="card space-y-3">
      <div className="flex flex-wrap items-center gap-3">
        <p className="mr-auto font-semibold" aria-live="polite">
          {p.saving ? "Saving…" : p.dirty ? "Unsaved changes" : "All changes saved"}
        </p>
        <button type="button" className="btn-quiet" onClick={p.onSave} disabled={!p.dirty || p.saving}>
          Save draft
        </button>
        <button
          type="button"
          className="btn-primary"
          onClick={p.onPublish}
          disabled={!!p.publishBlocked || p.saving || p.publishing}
          aria-describedby="publish-why"
        >
          {p.dirty ? "Save and publish" : "Publish"}
        </button>
      </div>
      {p.publishBlocked && (
        <p id="publish-why" className="text-sm text-ink-soft">
          {p.publishBlocked}
        </p>
      )}
      {p.conflict && (
        <div className="notice-error space-y-2" role="alert">
          <p>
            Someone else saved this draft{p.conflict.updatedByName ? ` (${p.conflict.updatedByName})` : ""} at{" "}
            {when(p.conflict.updatedAt, style)}. Your changes were not saved, and theirs were not overwritten.
          </p>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="btn-danger" onClick={p.onReload}>
              Reload their version (your unsaved changes are lost)
            </button>
            <button type="button" className="btn-quiet" onClick={p.onKeepEditing}>
              Keep editing
            </button>
          </div>
        </div>
      )}
      {p.notice && (
        <div
          className={p.notice.tone === "error" ? "notice-error" : "notice-info"}
          role={p.notice.tone === "error" ? "alert" : "status"}
        >
          <p>{p.notice.text}</p>
          <FieldErrors issues={p.notice.issues} />
        </div>
      )}
      {p.jobId && <PublishProgress planId={p.planId} jobId={p.jobId} />}
    </div>
  );
}
