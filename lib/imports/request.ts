import "server-only";
import { createHash } from "node:crypto";
import { z } from "zod";
import { HttpError } from "@/lib/http/errors";
import { uploadedForm } from "@/lib/http/upload";
import { zodIssues } from "@/lib/http/zod-issues";
import { MAX_UPLOAD_BYTES } from "@/lib/sheets/read";
import { isImportKind, type ImportKind } from "./fields";

export type ImportRequest = {
  kind: ImportKind;
  bytes: Uint8Array;
  sha256: string;
  filename: string;
  layoutVersionId: number;
  mapping: unknown;
};

const formFields = z.object({
  layoutVersionId: z.coerce.number({ message: "Choose a layout version." }).int().positive("Choose a layout version."),
  mapping: z.string().max(10_000, "The column mapping is too long.").optional(),
});

export function kindOf(params: Record<string, string | string[] | undefined>): ImportKind {
  const kind = params.kind;
  if (typeof kind !== "string" || !isImportKind(kind))
    throw new HttpError(
      404,
      "Trailbin imports two kinds of sheet: “items” (the item master) and “orders” (order lines).",
    );
  return kind;
}

/** A file name fit to store and show: no control characters, at most 255 characters. */
const cleanName = (name: string) => name.replace(/[\u0000-\u001f\u007f]/g, "").slice(0, 255) || "upload";

/** The multipart form of a preview or an import: the file (size-checked first), layout version, mapping. */
export async function readImportRequest(req: Request, kind: ImportKind): Promise<ImportRequest> {
  const { form, file, bytes } = await uploadedForm(req, MAX_UPLOAD_BYTES, "spreadsheet");
  const text = (name: string) => {
    const v = form.get(name);
    return typeof v === "string" && v !== "" ? v : undefined;
  };
  const parsed = formFields.safeParse({ layoutVersionId: text("layoutVersionId"), mapping: text("mapping") });
  if (!parsed.success) throw new HttpError(400, "Some fields need attention.", { issues: zodIssues(parsed.error) });
  let mapping: unknown = undefined;
  if (parsed.data.mapping !== undefined) {
    try {
      mapping = JSON.parse(parsed.data.mapping);
    } catch {
      throw new HttpError(400, "The column mapping could not be read. Choose the columns again.");
    }
  }
  const filename = cleanName(file.name);
  return {
    kind,
    bytes,
    sha256: createHash("sha256").update(bytes).digest("hex"),
    filename,
    layoutVersionId: parsed.data.layoutVersionId,
    mapping,
  };
}
