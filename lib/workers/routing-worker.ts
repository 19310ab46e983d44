// Worker-thread entry for RoutingPool (TypeScript; the pool registers tsx before loading it).
import { runTask } from "./routing-tasks";
import { serveTasks } from "./serve-tasks";

serveTasks(runTask);
