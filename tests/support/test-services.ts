import { execFile } from "node:child_process";
import { promisify } from "node:util";

const run = promisify(execFile);

/** Stops or starts the test MariaDB or mail sink of the running npm test (scripts/test-services.sh). */
export async function testService(service: "mariadb" | "mail-sink", action: "stop" | "start"): Promise<void> {
  const command = process.env.TRAILBIN_TEST_SERVICES;
  if (!command) throw new Error("TRAILBIN_TEST_SERVICES is not set: run the fault tests through npm test");
  try {
    await run(command, [service, action], { timeout: 90_000 });
  } catch (e) {
    const out = e as { stdout?: string; stderr?: string; message: string };
    throw new Error(`${service} ${action} failed: ${out.message}\n${out.stdout ?? ""}${out.stderr ?? ""}`);
  }
}
