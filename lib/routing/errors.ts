/** Stops that no tour from the start to the end can visit. Names them by index and, when known, by bin code. */
export class UnreachableStopError extends Error {
  readonly stops: number[];
  readonly codes: string[];
  constructor(stops: number[], codes: string[] = [], detail = "cannot be reached on a walk from the start to the end") {
    const names = codes.length > 0 ? codes.join(", ") : stops.map((s) => `#${s}`).join(", ");
    super(`unreachable stop${stops.length === 1 ? "" : "s"} ${names}: ${detail}`);
    this.name = "UnreachableStopError";
    this.stops = stops;
    this.codes = codes;
  }
}

/** Costs large enough that a tour length could reach the Int32 sentinel range. */
export class CostOverflowError extends RangeError {
  constructor(bound: number) {
    super(`tour length could reach ${bound}, beyond the Int32 distance range`);
    this.name = "CostOverflowError";
  }
}

/** Requested bins or points the graph does not hold. */
export class UnknownLocationError extends Error {
  readonly codes: string[];
  constructor(codes: string[]) {
    super(`unknown location${codes.length === 1 ? "" : "s"}: ${codes.join(", ")}`);
    this.name = "UnknownLocationError";
    this.codes = codes;
  }
}
