// Runs once when the server starts.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  // First, so that the throttles and the audit log know each client's real address.
  (await import("./lib/http/client-address-setup")).startClientAddresses();
  // Without its public origin the server would refuse every change (the Origin check) and mail
  // links that lead nowhere: stop here with what to set rather than serve like that.
  const { publicOrigins } = await import("./lib/http/origin");
  try {
    publicOrigins();
  } catch (e) {
    console.error(`Trailbin cannot start: ${(e as Error).message}`);
    process.exit(1);
  }
  try {
    const { failJobsOfPreviousRun } = await import("./lib/jobs/server");
    const n = await failJobsOfPreviousRun();
    if (n > 0) console.log(`marked ${n} job(s) left over from the previous server run as failed`);
  } catch (e) {
    console.error("could not clear jobs left over from the previous run:", (e as Error).message);
  }
  try {
    // One outbox sender per server process; the claim in db/outbox.ts keeps several processes apart.
    const { startOutboxSender } = await import("./lib/mail/sender");
    await startOutboxSender();
  } catch (e) {
    console.error("could not start the outbox sender:", (e as Error).message);
  }
}
