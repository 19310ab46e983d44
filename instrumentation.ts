// Runs once when the server starts.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  try {
    const { failOrphanedJobs } = await import("./db/jobs");
    const n = await failOrphanedJobs();
    if (n > 0) console.log(`marked ${n} job(s) left over from the previous server run as failed`);
  } catch (e) {
    console.error("could not clear jobs left over from the previous run:", (e as Error).message);
  }
}
