"use client";

import { useCallback, useLayoutEffect, useRef, useState } from "react";
import type { FieldIssue } from "@/lib/http/zod-issues";
import type { Problem } from "@/lib/floor-plan/checks";
import { isDirty, type EditorState, type Intent } from "@/lib/floor-plan/editor-state";
import { revision } from "@/lib/floor-plan/history";
import { publishProblems, saveDraft, startPublish, type SaveConflict } from "./api";

export type SyncNotice = { tone: "error" | "info"; text: string; issues?: FieldIssue[] } | null;

/**
 * Saving and publishing the draft under optimistic locking: every save names the version it was
 * based on, and a 409 is shown to the person, never overwritten.
 */
export function useDraftSync(
  planId: number,
  initialVersion: number,
  state: EditorState,
  dispatch: (i: Intent) => void,
) {
  const version = useRef(initialVersion);
  const [saving, setSaving] = useState(false);
  const [publishing, setPublishing] = useState(false);
  const [conflict, setConflict] = useState<SaveConflict["current"] | null>(null);
  const [notice, setNotice] = useState<SyncNotice>(null);
  const [serverProblems, setServerProblems] = useState<Problem[]>([]);
  const [jobId, setJobId] = useState<string | null>(null);
  // Saves read the newest state, also when started from a callback made before the last edit.
  const stateRef = useRef(state);
  useLayoutEffect(() => {
    stateRef.current = state;
  });

  const save = useCallback(async (): Promise<boolean> => {
    const s = stateRef.current;
    if (!isDirty(s)) return true;
    const rev = revision(s.history);
    setSaving(true);
    setNotice(null);
    const r = await saveDraft(planId, version.current, s.history.present);
    setSaving(false);
    if (r.ok) {
      version.current = r.data.version;
      // Edits made while the save was on its way stay unsaved.
      dispatch({ type: "saved", revision: rev });
      setConflict(null);
      setNotice({ tone: "info", text: "Draft saved." });
      return true;
    }
    if (r.status === 409) {
      const current = (r.body as SaveConflict | undefined)?.current;
      setConflict(current ?? { version: -1, updatedByName: null, updatedAt: "" });
      return false;
    }
    setNotice({ tone: "error", text: r.message, issues: r.issues });
    return false;
  }, [planId, dispatch]);

  const publish = useCallback(async () => {
    setServerProblems([]);
    setJobId(null);
    if (!(await save())) return;
    setPublishing(true);
    const r = await startPublish(planId, version.current);
    setPublishing(false);
    if (r.ok) {
      setJobId(String(r.data.jobId));
      setNotice(null);
      return;
    }
    if (r.status === 422) setServerProblems(publishProblems(r));
    if (r.status === 409)
      setNotice({ tone: "error", text: `${r.message} Reload the draft to see the saved version, then publish again.` });
    else setNotice({ tone: "error", text: r.message });
  }, [planId, save]);

  return {
    save,
    publish,
    saving,
    publishing,
    conflict,
    dismissConflict: () => setConflict(null),
    notice,
    serverProblems,
    jobId,
  };
}
