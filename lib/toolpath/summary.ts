/** A readable, plain-text summary of a report, for the CLI and for logs. */
import type { ToolpathReport } from "./types";

export function formatSummary(report: ToolpathReport, fileName = "program"): string {
  const out: string[] = [];
  const mm = (v: number) => `${v.toFixed(1)} mm`;
  out.push(`${fileName}: ${report.lines} lines, ${report.blocks} blocks, ${report.motionBlocks} motion blocks, units ${report.units}`);
  out.push(`sha256 ${report.sha256} (${report.bytes} bytes)`);
  out.push(`cycle time ${duration(report.cycleTimeS)} = feed ${duration(report.feedTimeS)} + rapid ${duration(report.rapidTimeS)}` +
    ` + dwell ${duration(report.dwellTimeS)} + tool changes ${duration(report.toolChangeTimeS)} (machine: ${report.machineProfile})`);
  out.push(`path: feed ${mm(report.feedLengthMm)}, rapid ${mm(report.rapidLengthMm)}, ${report.arcs} arcs` +
    (report.unmeasuredMoves ? `, ${report.unmeasuredMoves} moves not measured (position unknown)` : ""));
  const axes = Object.entries(report.bounds).map(([axis, b]) => {
    const unit = "XYZ".includes(axis) ? "" : "°";
    return `${axis} ${b.min.toFixed(3)}${unit} … ${b.max.toFixed(3)}${unit}`;
  });
  out.push(`extent: ${axes.join(", ") || "none"}`);
  const rotary = Object.entries(report.rotaryTravelDeg).map(([axis, v]) => `${axis} ${v.toFixed(1)}°`);
  if (rotary.length) out.push(`rotary travel: ${rotary.join(", ")}`);
  out.push(`tools (${report.toolChanges} changes):`);
  for (const t of report.tools) {
    const feed = t.feedMmPerMin ? `F ${t.feedMmPerMin.min}–${t.feedMmPerMin.max} mm/min` : "no cutting";
    const rpm = t.spindleRpm ? `S ${t.spindleRpm.min}–${t.spindleRpm.max}` : "S —";
    out.push(`  T${t.number}  lines ${t.firstLine}–${t.lastLine}  ${feed}  ${rpm}  ${mm(t.feedLengthMm)} in ${duration(t.feedTimeS)}`);
  }
  const checks = report.checks;
  out.push(`checks: travel ${checks.travel}, rotary limits ${yesNo(checks.rotaryLimits)}, plate ${yesNo(checks.plateEnvelope)},` +
    ` max feed ${yesNo(checks.maxFeed)}, max spindle ${yesNo(checks.maxSpindle)}`);
  if (report.violations.length === 0) {
    out.push("violations: none");
  } else {
    out.push(`violations (${report.violations.length}):`);
    for (const v of report.violations) out.push(`  line ${v.firstLine}: ${v.message} (${v.count}×, worst at line ${v.worstLine})`);
  }
  const counts = Object.entries(report.warningCounts);
  if (counts.length === 0) {
    out.push("warnings: none");
  } else {
    out.push(`warnings: ${counts.map(([code, n]) => `${code} ×${n}`).join(", ")}`);
    for (const w of report.warnings.slice(0, 20)) out.push(`  line ${w.line}: ${w.message}`);
    if (report.warnings.length > 20 || report.warningsTruncated) out.push("  … (use --json for the kept list)");
  }
  out.push(`preview: ${report.previewVertices} vertices within ${report.previewToleranceMm.toPrecision(2)} mm`);
  return out.join("\n");
}

function yesNo(v: boolean): string {
  return v ? "yes" : "no";
}

/** 3725.4 s → "1 h 02 min 05 s". */
export function duration(seconds: number): string {
  const s = Math.round(seconds);
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  const r = s % 60;
  if (h > 0) return `${h} h ${String(m).padStart(2, "0")} min ${String(r).padStart(2, "0")} s`;
  if (m > 0) return `${m} min ${String(r).padStart(2, "0")} s`;
  return `${seconds < 10 ? seconds.toFixed(1) : r} s`;
}
