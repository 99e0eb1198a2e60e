/** The look every chart shares, in the app's palette: axis text, grid lines, tooltip box. */
export const AXIS_TEXT = { fontSize: 11, fill: "#57524b" } as const;
export const GRID_STROKE = "#ddd5c7";
export const TOOLTIP_STYLE = { fontSize: 12, borderColor: "#ddd5c7", background: "#fffdf9" } as const;
