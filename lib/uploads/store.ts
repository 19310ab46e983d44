import "server-only";
import { randomBytes } from "node:crypto";
import { mkdir, readFile, writeFile } from "node:fs/promises";
import path from "node:path";

// Under the ignored data folder; npm test points UPLOAD_DIR at its own.
const root = () =>
  path.resolve(/*turbopackIgnore: true*/ process.env.UPLOAD_DIR ?? path.join(process.cwd(), ".data/uploads"));

/** Files are named by a random id only: nothing a user typed ever becomes part of a path. */
export async function storeFile(bytes: Uint8Array): Promise<string> {
  const id = randomBytes(16).toString("hex");
  await mkdir(/*turbopackIgnore: true*/ root(), { recursive: true });
  await writeFile(/*turbopackIgnore: true*/ path.join(root(), id), bytes, { flag: "wx" });
  return id;
}

export async function readStoredFile(id: string): Promise<Buffer | null> {
  if (!/^[a-f0-9]{32}$/.test(id)) return null;
  try {
    return await readFile(/*turbopackIgnore: true*/ path.join(root(), id));
  } catch {
    return null;
  }
}

export function imageType(bytes: Uint8Array): "image/png" | "image/jpeg" | null {
  if (bytes.length > 8 && bytes[0] === 0x89 && bytes[1] === 0x50 && bytes[2] === 0x4e && bytes[3] === 0x47)
    return "image/png";
  if (bytes.length > 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return "image/jpeg";
  return null;
}
