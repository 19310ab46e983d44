"use client";

import { useState } from "react";
import type { EditorPoint } from "@/lib/floor-plan/document";
import type { PointKind } from "@/lib/floor-plan/commands";

type Props = {
  point: EditorPoint;
  kind: PointKind;
  canEdit: boolean;
  onRename: (name: string) => void;
  onDelete: () => void;
};

/** The selected depot or drop-off: its name (what batches and pick lists show) and removal. */
export function PointPanel({ point, kind, canEdit, onRename, onDelete }: Props) {
  const [name, setName] = useState(point.name);
  const what = kind === "depot" ? "Depot" : "Drop-off";
  return (
    <form
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        onRename(name);
      }}
    >
      <p className="text-sm text-ink-soft">
        {what} {point.id}, cell {point.x}, {point.y}. Arrow keys or dragging move it.
      </p>
      <label className="block">
        <span className="label">Name</span>
        <input
          className="field"
          value={name}
          maxLength={60}
          onChange={(e) => setName(e.target.value)}
          disabled={!canEdit}
        />
      </label>
      {canEdit && (
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn-primary" disabled={!name.trim() || name.trim() === point.name}>
            Rename
          </button>
          <button type="button" className="btn-danger" onClick={onDelete}>
            Delete {what.toLowerCase()}
          </button>
        </div>
      )}
    </form>
  );
}
