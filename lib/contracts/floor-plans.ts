// Floor plans and their drafts as the floor plan pages and the editor's draft API see them. Types only.
import type { EditorDocument } from "@/lib/floor-plan/document";

export type FloorPlanSummary = {
  id: number;
  name: string;
  draftVersion: number;
  draftUpdatedAt: string;
  latestVersion: { id: number; number: number; publishedAt: string; binCount: number; fromDraftVersion: number } | null;
};

export type DraftDTO = {
  floorPlanId: number;
  version: number;
  document: EditorDocument;
  updatedAt: string;
  updatedByName: string | null;
};

/** GET /api/floor-plans/[id]/draft */
export type DraftResponse = {
  draft: Omit<DraftDTO, "floorPlanId">;
  latestVersion: { id: number; number: number; publishedAt: string } | null;
};

/** PUT /api/floor-plans/[id]/draft, 409: someone saved first. */
export type SaveConflict = {
  error: string;
  current: { version: number; updatedByName: string | null; updatedAt: string };
};
