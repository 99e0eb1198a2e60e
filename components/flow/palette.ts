/**
 * Series styles for overlaid curves: colour plus a dash pattern and a marker shape, so two
 * curves are told apart without relying on colour (prints in grey too).
 */
export type SeriesStyle = { stroke: string; dash: string | undefined; marker: "circle" | "square" | "diamond" | "triangle"; name: string };

export const SERIES_STYLES: SeriesStyle[] = [
  { stroke: "#b0592d", dash: undefined, marker: "circle", name: "solid copper, circles" },
  { stroke: "#33312e", dash: "6 3", marker: "square", name: "dashed graphite, squares" },
  { stroke: "#2f6b3f", dash: "2 3", marker: "diamond", name: "dotted green, diamonds" },
  { stroke: "#8a5a00", dash: "10 3 2 3", marker: "triangle", name: "dash-dot amber, triangles" },
  { stroke: "#5b6b8c", dash: "4 4", marker: "circle", name: "dashed slate, circles" },
  { stroke: "#9b2c2c", dash: undefined, marker: "square", name: "solid red, squares" },
];

export const styleFor = (index: number): SeriesStyle => SERIES_STYLES[index % SERIES_STYLES.length];
