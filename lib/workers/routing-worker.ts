// Worker-thread entry for RoutingPool (TypeScript; the pool registers tsx before loading it).
import { startHeldKarpHelper } from "./held-karp-threads";
import { runTask } from "./routing-tasks";
import { serveTasks } from "./serve-tasks";
import { serveWhenSolversLoaded } from "./solvers-ready";

// Large Held–Karp tables (18+ stops) are shared with a second thread once it has loaded, where the
// machine has a second core; until then, and on one core, they run on this thread alone.
void startHeldKarpHelper();
serveWhenSolversLoaded(() => serveTasks(runTask));
