"use client";

import type { EditorDocument } from "@/lib/editor/document";
import type { PickViewDTO } from "@/lib/picking/view";

export function PickScreen({ initial }: { initial: PickViewDTO; document: EditorDocument | null }) {
  return <h1>Batch {initial.batch.number}</h1>;
}
