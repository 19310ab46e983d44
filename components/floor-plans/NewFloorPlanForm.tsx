"use client";

import { FailureNotice } from "@/components/FailureNotice";
import { usePostForm } from "@/components/usePostForm";

export function NewFloorPlanForm() {
  const { onSubmit, failure, busy } = usePostForm<{ id: number }>({
    url: "/api/floor-plans",
    body: (f) => ({
      name: String(f.get("name") ?? ""),
      widthM: Number(f.get("widthM")),
      heightM: Number(f.get("heightM")),
      cellMm: Number(f.get("cellMm")),
    }),
    onDone: (r) => window.location.assign(`/floor-plans/${r.id}`),
    leaves: true,
  });
  return (
    <form onSubmit={onSubmit} className="card mt-8 max-w-3xl space-y-4" noValidate aria-labelledby="new-plan">
      <h2 id="new-plan">Start a floor plan</h2>
      <div className="grid gap-4 sm:grid-cols-4">
        <label className="sm:col-span-4">
          <span className="label">Name</span>
          <input name="name" className="field" required maxLength={120} placeholder="e.g. Ground floor" />
        </label>
        <label>
          <span className="label">Width (m)</span>
          <input name="widthM" type="number" min="1" step="0.5" defaultValue="60" className="field" />
        </label>
        <label>
          <span className="label">Depth (m)</span>
          <input name="heightM" type="number" min="1" step="0.5" defaultValue="40" className="field" />
        </label>
        <label className="sm:col-span-2">
          <span className="label">Cell size</span>
          <select name="cellMm" className="field" defaultValue="1000">
            <option value="500">0.5 m (narrow aisles)</option>
            <option value="1000">1 m (most floors)</option>
            <option value="1500">1.5 m</option>
            <option value="2000">2 m (large floors)</option>
          </select>
        </label>
      </div>
      <FailureNotice failure={failure} />
      <button className="btn-primary" disabled={busy}>
        {busy ? "Creating…" : "Create and open the editor"}
      </button>
    </form>
  );
}
