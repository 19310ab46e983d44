// Worker-thread entry for RoutingPool (TypeScript; the pool registers tsx before loading it).
import { runJob } from "./routing-tasks";
import { serveJobs } from "./serve-tasks";

serveJobs(runJob);
