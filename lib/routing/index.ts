// Pure routing engine: no database, framework or Node-only imports here, so it runs in a
// worker thread or a browser. The worker pools that run it live in lib/workers/ (Node only).
export * from "./constants";
export * from "./drawing";
export * from "./graph";
export * from "./build-graph";
export * from "./kept-lines";
export * from "./limits";
export * from "./diagnostics";
export * from "./reachability";
export * from "./floyd-warshall";
export * from "./access";
export * from "./cost-matrix";
export * from "./certificate";
export * from "./degree-bound";
export * from "./errors";
export * from "./held-karp";
export * from "./local-search";
export * from "./sequence";
export * from "./baseline";
export * from "./plan";
export * from "./tsplib";
export * from "./generate";
export { mulberry32 } from "./random";
