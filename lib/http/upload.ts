import { HttpError } from "./errors";
import { readBodyCapped } from "./read-body";

// The form's other fields and its multipart framing, on top of the file itself.
const FORM_OVERHEAD_BYTES = 64 * 1024;

/**
 * The multipart form of an upload and its one file, refused by its declared size before any of it
 * is buffered (browsers always declare it for a form upload) and read no further than the cap.
 */
export async function uploadedForm(
  req: Request,
  maxBytes: number,
  what: string,
): Promise<{ form: FormData; file: File; bytes: Uint8Array }> {
  const declared = req.headers.get("content-length");
  if (!declared)
    throw new HttpError(411, "The upload did not say how large it is. Upload the file from the Trailbin page.");
  const mib = (maxBytes / 1024 / 1024).toFixed(0);
  const tooLarge = `The ${what} is larger than ${mib} MiB. Use a smaller file.`;
  if (Number(declared) > maxBytes + FORM_OVERHEAD_BYTES) throw new HttpError(413, tooLarge);
  const type = req.headers.get("content-type") ?? "";
  if (!type.startsWith("multipart/form-data")) {
    throw new HttpError(415, `Send the ${what} as a form upload (multipart/form-data) in a field called "file".`);
  }
  const body = await readBodyCapped(req, maxBytes + FORM_OVERHEAD_BYTES, tooLarge);
  let form: FormData;
  try {
    form = await new Response(body, { headers: { "content-type": type } }).formData();
  } catch {
    throw new HttpError(400, "The upload could not be read. Try again.");
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw new HttpError(400, `Choose a ${what} to upload (form field "file").`);
  if (file.size > maxBytes) throw new HttpError(413, tooLarge);
  return { form, file, bytes: new Uint8Array(await file.arrayBuffer()) };
}

/** The one uploaded file of a multipart request (see uploadedForm). */
export async function uploadedFile(req: Request, maxBytes: number, what: string): Promise<Uint8Array> {
  return (await uploadedForm(req, maxBytes, what)).bytes;
}
