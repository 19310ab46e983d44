// Published layout versions as pages, pickers and the version explorer see them. Types only.

export type LayoutVersionDTO = {
  id: number;
  floorPlanId: number;
  number: number;
  publishedAt: string;
  publishedByName: string | null;
  nodeCount: number;
  edgeCount: number;
  binCount: number;
  matrixSha256: string;
};

export type BinRowDTO = {
  code: string;
  rackRun: string;
  aisle: number;
  bay: number;
  level: number;
  x: number;
  y: number;
  accessPoint: number;
};

/** A choice of layout version in a form (the imports' "check bins against"). */
export type VersionOption = { id: number; label: string };

/** A layout version a new wave may be planned on, with the points a cart can start and end at. */
export type LayoutChoice = {
  id: number;
  label: string;
  depots: { id: string; name: string }[];
  dropoffs: { id: string; name: string }[];
};
