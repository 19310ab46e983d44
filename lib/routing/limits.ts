/**
 * The most junctions a published floor plan may have. Floyd–Warshall is cubic in them and keeps two
 * n × n Int32 matrices: measured on this 2-core machine (docs/benchmarks.md) 2,025 junctions took
 * 38–46 s and 31 MiB of matrices, 2,601 took 90 s; 2,000 keeps a publish under a minute with the
 * machine shared, and a cached layout version at 31 MiB.
 */
export const MAX_JUNCTIONS = 2000;
