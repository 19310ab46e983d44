import { loadHighs } from "../routing/lp/highs";

/**
 * Starts serving once the LP solver is loaded, so every route a worker plans gets the same bound
 * whether it came first or last. Posted tasks wait in the port meanwhile. If HiGHS cannot load the
 * worker still serves: routes then carry the weaker degree bound, and the log says why.
 */
export function serveWhenSolversLoaded(serve: () => void): void {
  loadHighs().then(serve, (e: unknown) => {
    console.error("HiGHS did not load; routes past Held–Karp's reach get only the degree bound:", e);
    serve();
  });
}
