"use client";

import { FileField } from "@/components/FileField";
import { useState } from "react";
import type { EditorDocument } from "@/lib/floor-plan/document";
import type { Intent } from "@/lib/floor-plan/editor-state";
import { uploadBackground } from "./api";

type Props = { planId: number; doc: EditorDocument; dispatch: (i: Intent) => void };

/** A scanned or exported plan under the drawing, to trace walls and racks from. */
export function BackgroundPanel({ planId, doc, dispatch }: Props) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const bg = doc.background;

  async function onFile(file: File) {
    setError(null);
    if (!/^image\/(png|jpeg)$/.test(file.type)) {
      setError("Choose a PNG or JPEG picture.");
      return;
    }
    setBusy(true);
    const r = await uploadBackground(planId, file);
    setBusy(false);
    if (!r.ok) setError(r.message);
    else
      dispatch({
        type: "do",
        command: { type: "set-background", background: { fileId: r.data.fileId, opacity: bg?.opacity ?? 0.35 } },
      });
  }

  return (
    <div className="space-y-3">
      <FileField
        label="Background picture (PNG or JPEG)"
        accept="image/png,image/jpeg"
        disabled={busy}
        onFile={(f) => void onFile(f)}
        hint="It is stretched over the whole grid; size the grid to the picture first."
      />
      {busy && <p role="status">Uploading…</p>}
      {error && (
        <p className="notice-error text-sm" role="alert">
          {error}
        </p>
      )}
      {bg && (
        <>
          <label className="block">
            <span className="label">Picture strength: {Math.round(bg.opacity * 100)} %</span>
            <input
              type="range"
              className="min-h-tap w-full"
              min={5}
              max={100}
              step={5}
              value={Math.round(bg.opacity * 100)}
              onChange={(e) =>
                dispatch({
                  type: "do",
                  command: { type: "set-background-opacity", opacity: Number(e.target.value) / 100 },
                })
              }
            />
          </label>
          <button
            type="button"
            className="btn-quiet"
            onClick={() => dispatch({ type: "do", command: { type: "set-background", background: null } })}
          >
            Remove picture
          </button>
        </>
      )}
    </div>
  );
}
