/** SVG colours from the palette in tailwind.config.ts (SVG fills cannot take Tailwind classes everywhere). */
export const FLOOR_COLOURS = {
  outside: "#ebe7de",
  floor: "#ffffff",
  blocked: "#3b4a57",
  grid: "#dfe4ea",
  rack: "#dfe4ea",
  rackEdge: "#5b6b7a",
  face: "#16212b",
  oneWay: "#9a4d00",
  point: "#0e6b58",
  pointText: "#ffffff",
  highlight: "#a4161a",
  highlightFill: "rgba(164, 22, 26, 0.22)",
  selected: "#0e6b58",
  route: "#0e6b58",
} as const;
