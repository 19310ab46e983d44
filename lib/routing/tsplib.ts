import type { CostMatrix } from "./cost-matrix";

export interface TsplibInstance extends CostMatrix {
  name: string;
  type: "TSP" | "ATSP";
}

// Constants exactly as the TSPLIB specification gives them (Reinelt 1991), not Math.PI.
const PI = 3.141592;
const RRR = 6378.388;

function geoRadians(x: number): number {
  const deg = Math.trunc(x);
  const min = x - deg;
  return (PI * (deg + (5.0 * min) / 3.0)) / 180.0;
}

function geoDistance(a: [number, number], b: [number, number]): number {
  const [latI, lonI] = [geoRadians(a[0]), geoRadians(a[1])];
  const [latJ, lonJ] = [geoRadians(b[0]), geoRadians(b[1])];
  const q1 = Math.cos(lonI - lonJ);
  const q2 = Math.cos(latI - latJ);
  const q3 = Math.cos(latI + latJ);
  return Math.trunc(RRR * Math.acos(0.5 * ((1.0 + q1) * q2 - (1.0 - q1) * q3)) + 1.0);
}

function euc2d(a: [number, number], b: [number, number]): number {
  return Math.round(Math.hypot(a[0] - b[0], a[1] - b[1]));
}

/** Fills cost from an EXPLICIT weight list in the given TSPLIB EDGE_WEIGHT_FORMAT. */
function explicitMatrix(n: number, format: string, w: number[]): Int32Array {
  const cost = new Int32Array(n * n);
  const set = (i: number, j: number, v: number) => {
    cost[i * n + j] = v;
    cost[j * n + i] = v;
  };
  let k = 0;
  const take = () => {
    const v = w[k++];
    if (v === undefined) throw new Error(`EDGE_WEIGHT_SECTION too short for ${format} of dimension ${n}`);
    return v;
  };
  if (format === "FULL_MATRIX") {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) cost[i * n + j] = take();
  } else if (format === "LOWER_DIAG_ROW") {
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) set(i, j, take());
  } else if (format === "UPPER_DIAG_ROW") {
    for (let i = 0; i < n; i++) for (let j = i; j < n; j++) set(i, j, take());
  } else if (format === "LOWER_ROW") {
    for (let i = 1; i < n; i++) for (let j = 0; j < i; j++) set(i, j, take());
  } else if (format === "UPPER_ROW") {
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) set(i, j, take());
  } else {
    throw new Error(`unsupported EDGE_WEIGHT_FORMAT ${format}`);
  }
  return cost;
}

/** Parses a TSPLIB TSP or ATSP file (EXPLICIT, GEO or EUC_2D weights) into a cost matrix. */
export function parseTsplib(text: string): TsplibInstance {
  const spec = new Map<string, string>();
  const lines = text.split(/\r?\n/);
  let section = "";
  const numbers: number[] = [];
  const coords = new Map<number, [number, number]>();
  for (const raw of lines) {
    const line = raw.trim();
    if (line === "" || line === "EOF") continue;
    const kv = /^([A-Z_]+)\s*:\s*(.*)$/.exec(line);
    if (kv) {
      spec.set(kv[1] as string, (kv[2] as string).trim());
      section = "";
      continue;
    }
    if (/^[A-Z_]+_SECTION$/.test(line)) {
      section = line;
      continue;
    }
    const parts = line.split(/\s+/).map(Number);
    if (section === "EDGE_WEIGHT_SECTION") numbers.push(...parts);
    else if (section === "NODE_COORD_SECTION" && parts.length >= 3)
      coords.set(parts[0] as number, [parts[1] as number, parts[2] as number]);
  }
  const name = spec.get("NAME") ?? "unnamed";
  const type = spec.get("TYPE");
  if (type !== "TSP" && type !== "ATSP") throw new Error(`unsupported TYPE ${type ?? "(missing)"}`);
  const n = Number(spec.get("DIMENSION"));
  if (!Number.isInteger(n) || n < 1) throw new Error("missing or invalid DIMENSION");
  const weightType = spec.get("EDGE_WEIGHT_TYPE");
  if (weightType === "EXPLICIT") {
    return { name, type, n, cost: explicitMatrix(n, spec.get("EDGE_WEIGHT_FORMAT") ?? "", numbers) };
  }
  const metric = weightType === "GEO" ? geoDistance : weightType === "EUC_2D" ? euc2d : undefined;
  if (!metric) throw new Error(`unsupported EDGE_WEIGHT_TYPE ${weightType ?? "(missing)"}`);
  const pts: [number, number][] = [];
  for (let i = 1; i <= n; i++) {
    const p = coords.get(i);
    if (!p) throw new Error(`missing coordinates for node ${i}`);
    pts.push(p);
  }
  const cost = new Int32Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++)
      if (i !== j) cost[i * n + j] = metric(pts[i] as [number, number], pts[j] as [number, number]);
  return { name, type, n, cost };
}
