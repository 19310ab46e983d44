import "server-only";
import { createHash } from "node:crypto";
import type { Knex } from "knex";
import { db } from "./knex";
import { insertInChunks } from "./rows";
import type { CompactGraph } from "@/lib/routing/graph";
import type { DistanceMatrix } from "@/lib/routing/floyd-warshall";
import type { EditorDocument } from "@/lib/floor-plan/document";
import type { BinRowDTO, LayoutVersionDTO } from "@/lib/contracts/layout-versions";

// Int32 matrices go to the database as little-endian bytes, whatever the server's byte order.
export function int32ToBytes(a: Int32Array): Buffer {
  const b = Buffer.alloc(a.length * 4);
  for (let i = 0; i < a.length; i++) b.writeInt32LE(a[i] as number, i * 4);
  return b;
}

export function bytesToInt32(b: Buffer): Int32Array {
  const a = new Int32Array(b.length / 4);
  for (let i = 0; i < a.length; i++) a[i] = b.readInt32LE(i * 4);
  return a;
}

export function matrixChecksum(dist: Buffer, next: Buffer): string {
  return createHash("sha256").update(dist).update(next).digest("hex");
}

/**
 * Rows of an n × n Int32 matrix per stored piece. mysql2 sends a Buffer as hex text (two characters a
 * byte), so a piece of packet / 8 bytes makes a statement of about a quarter of the packet: room for
 * the rest of the statement and for a server whose setting is lowered later. At most 4 MiB a piece.
 */
export function matrixRowsPerChunk(n: number, maxAllowedPacket: number): number {
  const bytes = Math.min(4 * 2 ** 20, Math.floor(maxAllowedPacket / 8));
  return Math.max(1, Math.floor(bytes / (4 * Math.max(1, n))));
}

async function maxAllowedPacket(trx: Knex.Transaction): Promise<number> {
  const [rows] = await trx.raw("SELECT @@max_allowed_packet AS p");
  return Number(rows[0].p);
}

async function insertMatrix(
  trx: Knex.Transaction,
  layoutVersionId: number,
  matrix: "dist" | "next",
  bytes: Buffer,
  n: number,
  rowsPerChunk: number,
) {
  for (let chunk = 0, row = 0; row < n; chunk++, row += rowsPerChunk) {
    const end = Math.min(n, row + rowsPerChunk);
    await trx("layout_matrix_chunks").insert({
      layout_version_id: layoutVersionId,
      matrix,
      chunk,
      first_row: row,
      bytes: bytes.subarray(row * n * 4, end * n * 4),
    });
  }
}

/** The stored pieces of one matrix joined again, or null when the version keeps its matrices inline. */
async function readMatrix(
  q: Knex | Knex.Transaction,
  layoutVersionId: number,
  matrix: "dist" | "next",
): Promise<Buffer | null> {
  const rows = await q("layout_matrix_chunks")
    .where({ layout_version_id: layoutVersionId, matrix })
    .orderBy("chunk")
    .select("bytes");
  return rows.length ? Buffer.concat(rows.map((r: { bytes: Buffer }) => r.bytes)) : null;
}

export type PublishInput = {
  floorPlanId: number;
  fromDraftVersion: number;
  document: EditorDocument;
  graph: CompactGraph;
  matrix: DistanceMatrix;
  rackRunOfBin: Map<string, string>;
  userId: string | null;
};

export class AlreadyPublishedError extends Error {
  constructor(readonly existing: { id: number; number: number }) {
    super("this draft version is already published");
  }
}

/** Everything of a layout version in one transaction: it exists whole or not at all. */
/** `beforeCommit` runs last inside the transaction (the publish job marks itself done there); throwing rolls it all back. */
export async function insertLayoutVersion(
  input: PublishInput,
  beforeCommit?: (trx: Knex.Transaction, stored: { id: number; number: number }) => Promise<void>,
): Promise<{ id: number; number: number }> {
  const dist = int32ToBytes(input.matrix.dist);
  const next = int32ToBytes(input.matrix.next);
  return db().transaction(async (trx) => {
    // Serialise publishers of one floor plan; the unique keys back this up.
    await trx("floor_plans").where({ id: input.floorPlanId }).forUpdate().first("id");
    const existing = await trx("layout_versions")
      .where({ floor_plan_id: input.floorPlanId, from_draft_version: input.fromDraftVersion })
      .first("id", "number");
    if (existing) throw new AlreadyPublishedError(existing);
    const max = await trx("layout_versions").where({ floor_plan_id: input.floorPlanId }).max({ n: "number" }).first();
    const number = Number(max?.n ?? 0) + 1;
    const [id] = await trx("layout_versions").insert({
      floor_plan_id: input.floorPlanId,
      number,
      from_draft_version: input.fromDraftVersion,
      document: JSON.stringify(input.document),
      cell_mm: input.graph.cellMm,
      node_count: input.graph.nodes.length,
      edge_count: input.graph.edges.length,
      bin_count: input.graph.bins.length,
      dist_matrix: null,
      next_matrix: null,
      matrix_sha256: matrixChecksum(dist, next),
      published_by: input.userId,
    });
    const v = Number(id);
    const rowsPerChunk = matrixRowsPerChunk(input.matrix.n, await maxAllowedPacket(trx));
    await insertMatrix(trx, v, "dist", dist, input.matrix.n, rowsPerChunk);
    await insertMatrix(trx, v, "next", next, input.matrix.n, rowsPerChunk);
    // Read back before committing: a version whose matrices do not come back whole is never published.
    const none = Buffer.alloc(0);
    const back = matrixChecksum((await readMatrix(trx, v, "dist")) ?? none, (await readMatrix(trx, v, "next")) ?? none);
    if (back !== matrixChecksum(dist, next))
      throw new Error(`layout version ${v}: the stored matrices do not read back as written`);
    await insertInChunks(
      trx,
      "layout_nodes",
      input.graph.nodes.map((n) => ({
        layout_version_id: v,
        node: n.id,
        x: n.x,
        y: n.y,
        kind: n.kind,
        label: n.label ?? null,
      })),
    );
    await insertInChunks(
      trx,
      "layout_edges",
      input.graph.edges.map((e) => ({
        layout_version_id: v,
        edge: e.id,
        from_node: e.from,
        to_node: e.to,
        length_mm: e.lengthMm,
        one_way: e.oneWay,
        cells: JSON.stringify(e.cells),
      })),
    );
    await insertInChunks(
      trx,
      "layout_access_points",
      input.graph.accessPoints.map((a) => ({
        layout_version_id: v,
        access_point: a.id,
        x: a.x,
        y: a.y,
        node: a.node,
        edge: a.edge,
        offset_mm: a.offsetMm,
      })),
    );
    await insertInChunks(
      trx,
      "layout_bins",
      input.graph.bins.map((b) => {
        const ap = input.graph.accessPoints[b.accessPoint];
        return {
          layout_version_id: v,
          code: b.code,
          rack_run: input.rackRunOfBin.get(b.code) ?? "",
          aisle: b.aisle,
          bay: b.bay,
          level: b.level,
          x: ap?.x ?? 0,
          y: ap?.y ?? 0,
          access_point: b.accessPoint,
        };
      }),
    );
    await beforeCommit?.(trx, { id: v, number });
    return { id: v, number };
  });
}

type VersionRow = {
  id: number;
  floor_plan_id: number;
  number: number;
  published_at: Date;
  display_name: string | null;
  node_count: number;
  edge_count: number;
  bin_count: number;
  matrix_sha256: string;
};

const toVersionDTO = (r: VersionRow): LayoutVersionDTO => ({
  id: r.id,
  floorPlanId: r.floor_plan_id,
  number: r.number,
  publishedAt: r.published_at.toISOString(),
  publishedByName: r.display_name,
  nodeCount: r.node_count,
  edgeCount: r.edge_count,
  binCount: r.bin_count,
  matrixSha256: r.matrix_sha256,
});

const versionColumns = [
  "v.id",
  "v.floor_plan_id",
  "v.number",
  "v.published_at",
  "u.display_name",
  "v.node_count",
  "v.edge_count",
  "v.bin_count",
  "v.matrix_sha256",
];

function versionsOfSite(siteId: number) {
  return db()("layout_versions as v")
    .join("floor_plans as p", "p.id", "v.floor_plan_id")
    .leftJoin("users as u", "u.id", "v.published_by")
    .where("p.site_id", siteId);
}

export async function listLayoutVersions(siteId: number, floorPlanId: number): Promise<LayoutVersionDTO[]> {
  const rows = await versionsOfSite(siteId)
    .where("v.floor_plan_id", floorPlanId)
    .orderBy("v.number", "desc")
    .select(versionColumns);
  return rows.map(toVersionDTO);
}

export type SiteLayoutVersion = LayoutVersionDTO & { floorPlanName: string };

/**
 * The site's published versions with their floor plan's name, in one query: by floor plan name, newest
 * first; `latestOnly` keeps each floor plan's newest, `withDocument` adds the version's document.
 */
export async function listSiteLayoutVersions(
  siteId: number,
  which: { latestOnly?: boolean; withDocument: true },
): Promise<(SiteLayoutVersion & { document: EditorDocument })[]>;
export async function listSiteLayoutVersions(
  siteId: number,
  which?: { latestOnly?: boolean; withDocument?: false },
): Promise<SiteLayoutVersion[]>;
export async function listSiteLayoutVersions(
  siteId: number,
  which: { latestOnly?: boolean; withDocument?: boolean } = {},
): Promise<(SiteLayoutVersion & { document?: EditorDocument })[]> {
  const rows = await versionsOfSite(siteId)
    .modify((q) =>
      which.latestOnly
        ? q.whereRaw("v.number = (select max(number) from layout_versions w where w.floor_plan_id = v.floor_plan_id)")
        : q,
    )
    .orderBy([{ column: "p.name" }, { column: "v.number", order: "desc" }])
    .select([...versionColumns, "p.name as floor_plan_name", ...(which.withDocument ? ["v.document"] : [])]);
  return rows.map((r: VersionRow & { floor_plan_name: string; document?: string }) => ({
    ...toVersionDTO(r),
    floorPlanName: r.floor_plan_name,
    ...(which.withDocument ? { document: JSON.parse(r.document!) as EditorDocument } : {}),
  }));
}

export async function getLayoutVersion(
  siteId: number,
  floorPlanId: number,
  number: number,
): Promise<(LayoutVersionDTO & { document: EditorDocument }) | null> {
  const r = await versionsOfSite(siteId)
    .where({ "v.floor_plan_id": floorPlanId, "v.number": number })
    .first([...versionColumns, "v.document"]);
  return r ? { ...toVersionDTO(r), document: JSON.parse(r.document) } : null;
}

/** The stored graph and matrices, rebuilt into the engine's types, with the checksum verified. */
export async function loadLayoutGraph(
  layoutVersionId: number,
): Promise<{ graph: CompactGraph; matrix: DistanceMatrix; checksumOk: boolean }> {
  const v = await db()("layout_versions").where({ id: layoutVersionId }).first();
  if (!v) throw new Error(`no layout version ${layoutVersionId}`);
  const [nodes, edges, aps, bins] = await Promise.all([
    db()("layout_nodes").where({ layout_version_id: layoutVersionId }).orderBy("node"),
    db()("layout_edges").where({ layout_version_id: layoutVersionId }).orderBy("edge"),
    db()("layout_access_points").where({ layout_version_id: layoutVersionId }).orderBy("access_point"),
    db()("layout_bins").where({ layout_version_id: layoutVersionId }).orderBy("code"),
  ]);
  const doc = JSON.parse(v.document) as EditorDocument;
  const graph: CompactGraph = {
    width: doc.width,
    height: doc.height,
    cellMm: v.cell_mm,
    nodes: nodes.map(
      (n: { node: number; x: number; y: number; kind: "junction" | "depot" | "dropoff"; label: string | null }) => ({
        id: n.node,
        x: n.x,
        y: n.y,
        kind: n.kind,
        ...(n.label ? { label: n.label } : {}),
      }),
    ),
    edges: edges.map(
      (e: {
        edge: number;
        from_node: number;
        to_node: number;
        length_mm: number;
        one_way: number | boolean;
        cells: string;
      }) => ({
        id: e.edge,
        from: e.from_node,
        to: e.to_node,
        lengthMm: e.length_mm,
        oneWay: Boolean(e.one_way),
        cells: JSON.parse(e.cells),
      }),
    ),
    accessPoints: aps.map(
      (a: { access_point: number; x: number; y: number; node: number; edge: number; offset_mm: number }) => ({
        id: a.access_point,
        x: a.x,
        y: a.y,
        node: a.node,
        edge: a.edge,
        offsetMm: a.offset_mm,
      }),
    ),
    bins: bins.map((b: { code: string; aisle: number; bay: number; level: number; access_point: number }) => ({
      code: b.code,
      aisle: b.aisle,
      bay: b.bay,
      level: b.level,
      accessPoint: b.access_point,
    })),
    depots: nodes
      .filter((n: { kind: string }) => n.kind === "depot")
      .map((n: { label: string; node: number }) => ({ id: n.label, node: n.node })),
    dropoffs: nodes
      .filter((n: { kind: string }) => n.kind === "dropoff")
      .map((n: { label: string; node: number }) => ({ id: n.label, node: n.node })),
    unattachedBins: [],
    misplacedPoints: [],
  };
  const distBytes: Buffer = v.dist_matrix ?? (await readMatrix(db(), layoutVersionId, "dist")) ?? Buffer.alloc(0);
  const nextBytes: Buffer = v.next_matrix ?? (await readMatrix(db(), layoutVersionId, "next")) ?? Buffer.alloc(0);
  const n = nodes.length;
  const checksumOk = distBytes.length === 4 * n * n && matrixChecksum(distBytes, nextBytes) === v.matrix_sha256;
  return { graph, matrix: { n, dist: bytesToInt32(distBytes), next: bytesToInt32(nextBytes) }, checksumOk };
}

export async function listLayoutBins(layoutVersionId: number): Promise<BinRowDTO[]> {
  const rows = await db()("layout_bins").where({ layout_version_id: layoutVersionId }).orderBy("code");
  return rows.map(
    (b: {
      code: string;
      rack_run: string;
      aisle: number;
      bay: number;
      level: number;
      x: number;
      y: number;
      access_point: number;
    }) => ({
      code: b.code,
      rackRun: b.rack_run,
      aisle: b.aisle,
      bay: b.bay,
      level: b.level,
      x: b.x,
      y: b.y,
      accessPoint: b.access_point,
    }),
  );
}

export async function countLayoutRows(
  layoutVersionId: number,
): Promise<{ nodes: number; edges: number; accessPoints: number; bins: number }> {
  const count = async (table: string) =>
    Number((await db()(table).where({ layout_version_id: layoutVersionId }).count({ n: "*" }).first())?.n ?? 0);
  const [nodes, edges, accessPoints, bins] = await Promise.all(
    ["layout_nodes", "layout_edges", "layout_access_points", "layout_bins"].map(count),
  );
  return { nodes: nodes!, edges: edges!, accessPoints: accessPoints!, bins: bins! };
}

export async function getLayoutVersionById(siteId: number, id: number): Promise<LayoutVersionDTO | null> {
  const r = await versionsOfSite(siteId).where("v.id", id).first(versionColumns);
  return r ? toVersionDTO(r) : null;
}
