import { DOCUMENT_FORMAT, GROUND, type EditorDocument, type RackRun } from "../../../lib/floor-plan/document";

/*
 * Bramblegate, the invented warehouse of the invented Fennick Supply Co. (see docs/design.md), one cell per
 * metre. North (row 0) is the back wall, the front with the dock doors is to the south.
 *
 *   row 0        back wall
 *   rows 1–12    back half of eight aisles (dead ends at the back wall)
 *   row 13       middle cross-aisle
 *   rows 14–25   front half of the aisles; aisle 5's front half is the narrow one-way aisle
 *   row 26       front cross-aisle: depot (cart park) front left, packing drop-off front right
 *   row 27       front wall with the dock doors
 *   row 28       yard, outside the building
 *
 * Aisle a walks down column 3a−1 with a rack run on each side; neighbouring aisles' runs stand back to
 * back. Aisles are one cell wide because the routing graph wants single-cell corridors. Odd bays are on
 * the west side, even on the east, numbered from the front; column 25 is a side walkway from the middle
 * cross-aisle to packing.
 */
const WIDTH = 28;
const HEIGHT = 29;
const AISLES = 8;
const FRONT = 26;
const MIDDLE = 13;
const SIDE_WALK = 25;
const PATTERN = "{aisle:2}-{bay:3}-{level}";
const LEVELS = 4;
/** Building columns standing where a bay would be: [x, y]. */
const COLUMNS: [number, number][] = [
  [12, 1],
  [19, 14],
];
/** The narrow aisle, walked only northwards (from the front cross-aisle to the middle one). */
const ONE_WAY_AISLE = 5;

export function bramblegateDocument(): EditorDocument {
  const ground = Array.from({ length: WIDTH * HEIGHT }, () => GROUND.blocked as string);
  const paint = (x: number, y: number, g: string) => (ground[y * WIDTH + x] = g);
  for (let x = 0; x < WIDTH; x++) paint(x, HEIGHT - 1, GROUND.outside);
  for (let x = 1; x <= SIDE_WALK; x++) {
    paint(x, MIDDLE, GROUND.floor);
    paint(x, FRONT, GROUND.floor);
  }
  for (let y = MIDDLE; y <= FRONT; y++) paint(SIDE_WALK, y, GROUND.floor);
  for (let a = 1; a <= AISLES; a++) for (let y = 1; y < FRONT; y++) paint(walkColumn(a), y, GROUND.floor);

  const rackRuns: RackRun[] = [];
  for (let a = 1; a <= AISLES; a++) {
    const cx = walkColumn(a);
    rackRuns.push(
      run(a, "odd", "front", cx - 1, MIDDLE + 1, FRONT - 1, 1),
      run(a, "even", "front", cx + 1, MIDDLE + 1, FRONT - 1, 2),
      run(a, "odd", "back", cx - 1, 1, MIDDLE - 1, 25),
      run(a, "even", "back", cx + 1, 1, MIDDLE - 1, 26),
    );
  }

  const oneWay = [];
  for (let y = MIDDLE + 1; y < FRONT; y++)
    oneWay.push({ cell: y * WIDTH + walkColumn(ONE_WAY_AISLE), dir: "N" as const });

  return {
    format: DOCUMENT_FORMAT,
    width: WIDTH,
    height: HEIGHT,
    cellMm: 1000,
    ground: ground.join(""),
    oneWay,
    rackRuns,
    depots: [{ id: "D1", x: 1, y: FRONT, name: "Cart park" }],
    dropoffs: [{ id: "P1", x: SIDE_WALK, y: FRONT, name: "Packing" }],
    background: null,
  };
}

/** The demo's open draft: the published plan plus a new single-sided rack run along the packing wall. */
export function bramblegateDraftDocument(): EditorDocument {
  const doc = bramblegateDocument();
  const extra: RackRun = {
    id: "a09-odd-front",
    x: SIDE_WALK + 1,
    y: MIDDLE + 1,
    orientation: "v",
    length: FRONT - MIDDLE - 1,
    facing: "W",
    aisle: 9,
    firstBay: 1,
    bayStep: 2,
    bayDirection: "reverse",
    levels: LEVELS,
    pattern: PATTERN,
    customCodes: [],
  };
  return { ...doc, rackRuns: [...doc.rackRuns, extra] };
}

function walkColumn(aisle: number): number {
  return 3 * aisle - 1;
}

/** A vertical run on column x from row y0 to y1, shortened where a building column stands. */
function run(
  aisle: number,
  side: "odd" | "even",
  half: "front" | "back",
  x: number,
  y0: number,
  y1: number,
  firstBay: number,
): RackRun {
  let top = y0;
  let bottom = y1;
  for (const [cx, cy] of COLUMNS) {
    if (cx !== x) continue;
    if (cy === top) top++;
    if (cy === bottom) bottom--;
  }
  return {
    id: `a${String(aisle).padStart(2, "0")}-${side}-${half}`,
    x,
    y: top,
    orientation: "v",
    length: bottom - top + 1,
    // Odd bays stand west of the walkway and open east onto it; even bays the other way round.
    facing: side === "odd" ? "E" : "W",
    aisle,
    firstBay,
    bayStep: 2,
    // Counted from the front, i.e. against increasing y.
    bayDirection: "reverse",
    levels: LEVELS,
    pattern: PATTERN,
    customCodes: [],
  };
}
