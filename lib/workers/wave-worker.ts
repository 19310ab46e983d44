// Worker-thread entry for wave planning: batching plus an exact route per batch can take a while.
import { serveTasks } from "@/lib/workers/serve-tasks";
import { batchOrders } from "@/lib/batching/batching";
import { serveWhenSolversLoaded } from "./solvers-ready";
import type { WaveTask } from "./wave-task";

serveWhenSolversLoaded(() =>
  serveTasks<WaveTask>((task, onProgress) =>
    batchOrders(task.graph, task.matrix, task.orders, task.limits, {
      method: task.method,
      from: task.from,
      to: task.to,
      onProgress,
    }),
  ),
);
