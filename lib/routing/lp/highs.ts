import type { Highs } from "highs";

export type { Highs };

/**
 * The WebAssembly heap of a HiGHS instance grows with the largest model it has held and never
 * shrinks, so a long-lived process drops the instance once the heap passes this and loads afresh.
 */
export const HIGHS_HEAP_BUDGET = 256 * 1024 * 1024;

let instance: Highs | undefined;
let loading: Promise<void> | undefined;

/** Loads the solver once; later calls return at once until the instance is recycled. */
export function loadHighs(): Promise<void> {
  if (instance) return Promise.resolve();
  if (!loading) {
    // Loaded on first use, so routes that never need the LP never pay for the WebAssembly module.
    const load = import("highs").then((mod) => mod.default());
    loading = load.then(
      (h) => {
        instance = h;
        loading = undefined;
      },
      (e: unknown) => {
        loading = undefined;
        throw e;
      },
    );
  }
  return loading;
}

/** The loaded solver, or undefined until loadHighs() has resolved (or after a recycle). */
export function highsSolver(): Highs | undefined {
  return instance;
}

/** Bytes of WebAssembly memory the loaded instance holds (0 when none is loaded). */
export function highsHeapBytes(): number {
  return instance?.memoryBytes ?? 0;
}

/** Call after a solve: drops the instance when its heap has grown past the budget. */
export function recycleHighsIfLarge(budget = HIGHS_HEAP_BUDGET): boolean {
  if (!instance || instance.memoryBytes <= budget) return false;
  instance = undefined;
  return true;
}
