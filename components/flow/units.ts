/** How units read on screen (stored ids stay ASCII: inH2O, m3/s). */
export const PRESSURE_UNIT_LABEL: Record<string, string> = { inH2O: "inH₂O", Pa: "Pa", kPa: "kPa", hPa: "hPa", inHg: "inHg" };
export const FLOW_UNIT_LABEL: Record<string, string> = { cfm: "cfm", "L/s": "L/s", "m3/s": "m³/s", "m3/h": "m³/h" };
export const LENGTH_UNIT_LABEL: Record<string, string> = { mm: "mm", in: "in" };
export const AREA_UNIT_LABEL: Record<string, string> = { mm2: "mm²", cm2: "cm²", in2: "in²", m2: "m²" };
export const TEMPERATURE_UNIT_LABEL: Record<string, string> = { C: "°C", F: "°F", K: "K" };

/** A text box's value as a number: "" is no value; a decimal comma is read as a point. */
export function numeric(value: unknown): number | undefined {
  if (value === "" || value == null) return undefined;
  if (typeof value === "number") return value;
  const text = String(value).trim().replace(",", ".");
  return text === "" ? undefined : Number(text);
}
