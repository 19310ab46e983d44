import { chromium, type Browser } from "playwright-core";
import { mkdirSync } from "node:fs";
import path from "node:path";

export const ARTIFACTS = path.resolve(process.cwd(), "tests/artifacts");

/** Debian's chromium, with the flags that keep it off a closed network (it otherwise phones home at start). */
export async function launchBrowser(extraArgs: string[] = []): Promise<Browser> {
  mkdirSync(ARTIFACTS, { recursive: true });
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    headless: true,
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
      ...extraArgs,
    ],
  });
}
