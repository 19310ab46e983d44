import { HttpError } from "./errors";

/**
 * The one uploaded file of a multipart request, refused by its declared size before any of it is
 * buffered (browsers always declare it for a form upload).
 */
export async function uploadedFile(req: Request, maxBytes: number, what: string): Promise<Uint8Array> {
  const declared = req.headers.get("content-length");
  if (!declared) throw new HttpError(411, "The upload did not say how large it is. Upload the file from the Trailbin page.");
  const mib = (maxBytes / 1024 / 1024).toFixed(0);
  if (Number(declared) > maxBytes + 64 * 1024) throw new HttpError(413, `The ${what} is larger than ${mib} MiB. Use a smaller file.`);
  if (!(req.headers.get("content-type") ?? "").startsWith("multipart/form-data")) {
    throw new HttpError(415, `Send the ${what} as a form upload (multipart/form-data) in a field called "file".`);
  }
  let form: FormData;
  try {
    form = await req.formData();
  } catch {
    throw new HttpError(400, "The upload could not be read. Try again.");
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw new HttpError(400, `Choose a ${what} to upload (form field "file").`);
  if (file.size > maxBytes) throw new HttpError(413, `The ${what} is larger than ${mib} MiB. Use a smaller file.`);
  return new Uint8Array(await file.arrayBuffer());
}
