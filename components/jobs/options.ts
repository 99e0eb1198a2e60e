/** Small helpers shared by the job forms. */
export type Option = { id: number; label: string };

/** "" from a select means "none"; anything else is an id. */
export const idOrNull = (v: unknown) => (v === "" || v == null ? null : Number(v));
export const numberOrNull = (v: unknown) => (v === "" || v == null ? null : Number(v));

/** datetime-local value ↔ epoch ms, in the browser's time zone (the shop floor's clock). */
export function toLocalInput(ms: number): string {
  const d = new Date(ms);
  const pad = (n: number) => String(n).padStart(2, "0");
  return `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}`;
}
export const fromLocalInput = (v: unknown) => {
  if (v === "" || v == null) return null;
  const ms = new Date(String(v)).getTime();
  return Number.isFinite(ms) ? ms : Number.NaN;
};

/** The time of the action (called from event handlers and when a page is rendered on the server). */
export const currentTime = (): number => Date.now();
