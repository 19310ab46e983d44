// Worker-thread entry for RoutingPool (TypeScript; the pool registers tsx before loading it).
import { runJob } from "./jobs";
import { serveJobs } from "./serve-jobs";

serveJobs(runJob);
