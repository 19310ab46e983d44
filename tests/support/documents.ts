import { blankDocument, GROUND, type EditorDocument, type RackRun } from "@/lib/floor-plan/document";

export function run(
  partial: Partial<RackRun> & Pick<RackRun, "id" | "x" | "y" | "length" | "facing" | "aisle">,
): RackRun {
  return {
    orientation: "h",
    firstBay: 1,
    bayStep: 1,
    bayDirection: "forward",
    levels: 2,
    pattern: "{aisle:2}-{bay:2}-{level}",
    customCodes: [],
    ...partial,
  };
}

/**
 * A 12 × 7 floor: a front cross-aisle (row 6), a back one (row 0), one aisle (row 3) between two rack
 * runs facing it (rows 2 and 4), a depot at the front left and a drop-off at the front right.
 */
export function smallDocument(): EditorDocument {
  const d = blankDocument(12, 7, 1000);
  d.ground = GROUND.floor.repeat(12 * 7);
  d.rackRuns = [
    run({ id: "R1", x: 1, y: 2, length: 10, facing: "S", aisle: 1 }),
    run({ id: "R2", x: 1, y: 4, length: 10, facing: "N", aisle: 1, firstBay: 11 }),
  ];
  d.depots = [{ id: "D1", x: 0, y: 6, name: "Carts" }];
  d.dropoffs = [{ id: "P1", x: 11, y: 6, name: "Packing" }];
  return d;
}
