import { GROUND, type GroundChar } from "./document";
import type { PointKind } from "./commands";

export interface ToolRow {
  tool: string;
  /** The toolbar button's name. */
  label: string;
  /** The key that picks the tool, also shown on its button. */
  key: string;
  /** It changes the document, so only people who may edit are offered it. */
  edits: boolean;
  /** What to do with it, shown under the toolbar. */
  hint: string;
  /** The ground a drag paints. */
  paints?: GroundChar;
  /** The point a click places. */
  places?: PointKind;
  /** Picking it leaves the selection in place; every other tool clears it. */
  keepsSelection?: boolean;
}

/** Every editor tool in toolbar order: the toolbar, the keys, the reducer and the canvas all read this table. */
export const TOOLS = [
  {
    tool: "select",
    label: "Select",
    key: "V",
    edits: false,
    keepsSelection: true,
    hint: "Click a rack run, depot or drop-off to select it; drag to move it, or drag the empty floor to pan. Arrow keys move, Delete removes.",
  },
  { tool: "floor", label: "Floor", key: "F", edits: true, paints: GROUND.floor, hint: "Drag to paint walkable floor." },
  {
    tool: "blocked",
    label: "Blocked",
    key: "B",
    edits: true,
    paints: GROUND.blocked,
    hint: "Drag to paint walls, columns and docks.",
  },
  {
    tool: "erase",
    label: "Erase",
    key: "E",
    edits: true,
    paints: GROUND.outside,
    hint: "Drag to paint outside the building (clears one-way marks there).",
  },
  {
    tool: "rack",
    label: "Rack run",
    key: "R",
    edits: true,
    keepsSelection: true,
    hint: "Drag along a row or column of cells to draw a rack run, then fill in its numbering.",
  },
  {
    tool: "one-way",
    label: "One-way",
    key: "O",
    edits: true,
    hint: "Drag along an aisle to mark the walking direction.",
  },
  {
    tool: "depot",
    label: "Depot",
    key: "D",
    edits: true,
    places: "depot",
    hint: "Click walkable floor where pickers collect their carts.",
  },
  {
    tool: "dropoff",
    label: "Drop-off",
    key: "P",
    edits: true,
    places: "dropoff",
    hint: "Click walkable floor where carts are dropped for packing.",
  },
] as const satisfies readonly ToolRow[];

export type Tool = (typeof TOOLS)[number]["tool"];
export type ToolInfo = ToolRow & { tool: Tool };

const BY_TOOL = new Map<Tool, ToolInfo>(TOOLS.map((t) => [t.tool, t]));
const BY_KEY = new Map<string, Tool>(TOOLS.map((t) => [t.key.toLowerCase(), t.tool]));

export function toolRow(tool: Tool): ToolInfo {
  return BY_TOOL.get(tool) as ToolInfo;
}

/** The tool a key (as KeyboardEvent.key, any case) picks, if any. */
export function toolForKey(key: string): Tool | undefined {
  return BY_KEY.get(key.toLowerCase());
}

/** The tools offered to someone who may (or may not) edit. */
export function offeredTools(canEdit: boolean): readonly ToolInfo[] {
  return canEdit ? TOOLS : TOOLS.filter((t) => !t.edits);
}

/** The ground a drag with this tool paints, or undefined when it is not a paint tool. */
export function paintsWith(tool: Tool): GroundChar | undefined {
  return toolRow(tool).paints;
}
