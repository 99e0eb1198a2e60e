import { format } from "date-fns";

export function formatDateTime(ms: number | null | undefined): string {
  return ms == null ? "—" : format(new Date(ms), "yyyy-MM-dd HH:mm");
}

export function formatDate(ms: number | string | null | undefined): string {
  if (ms == null || ms === "") return "—";
  return format(typeof ms === "number" ? new Date(ms) : new Date(`${ms}T00:00:00`), "yyyy-MM-dd");
}

export function formatNumber(value: number | null | undefined, digits = 1): string {
  return value == null || !Number.isFinite(value) ? "—" : value.toLocaleString("en-US", { minimumFractionDigits: digits, maximumFractionDigits: digits });
}
