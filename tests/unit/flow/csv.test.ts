import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { computeFlowTest } from "@/lib/flow/compute";
import { type CsvImport, detectDelimiter, flowTestFromCsv, normalizeHeader, parseFlowCsv } from "@/lib/flow/csv";
import { MAX_POINTS } from "@/lib/flow/schema";

const fixture = (name: string) => readFileSync(path.resolve(__dirname, "../../fixtures/flow", name), "utf8");
function accepted(r: CsvImport) {
  if (!r.ok) throw new Error(`refused: ${JSON.stringify(r.errors)}`);
  return r;
}
function refused(r: CsvImport) {
  if (r.ok) throw new Error("expected the import to be refused");
  return r;
}

describe("header detection", () => {
  it("normalises separators, case and superscripts", () => {
    expect(normalizeHeader(" Flow [m³/s] ")).toBe("flow_m3_s");
    expect(normalizeHeader("Lift (in)")).toBe("lift_in");
  });
  it("reads an inch/cfm sheet with a comment line and an extra column", () => {
    const r = accepted(parseFlowCsv(fixture("intake-inch-cfm.csv")));
    expect(r.units).toEqual({ lift: "in", flow: "cfm" });
    expect(r.columns).toEqual({ lift: "lift_in", flow: "flow_cfm" });
    expect(r.ignoredColumns).toEqual(["note"]);
    expect(r.rows).toHaveLength(6);
    expect(r.rows[0]).toEqual({ line: 3, lift: 0.1, flow: 68 }); // line 1 is a comment, line 2 the header
  });
  it("reads a semicolon sheet in mm and L/s with decimal commas", () => {
    const r = accepted(parseFlowCsv(fixture("exhaust-metric-ls.csv")));
    expect(r.delimiter).toBe(";");
    expect(r.units).toEqual({ lift: "mm", flow: "L/s" });
    expect(r.rows[0]).toMatchObject({ lift: 2.5, flow: 20 });
  });
  it("reads a per-row depression column", () => {
    const r = accepted(parseFlowCsv(fixture("per-point-depression.csv")));
    expect(r.units.depression).toBe("inH2O");
    expect(r.rows[2]).toMatchObject({ lift: 12.7, flow: 205, depression: 22 });
  });
  it.each([
    ["lift_mm\tflow_m3s\n5\t0.05\n", { lift: "mm", flow: "m3/s" }],
    ["Valve Lift (mm),Air Flow (m3/h)\n5,180\n", { lift: "mm", flow: "m3/h" }],
    ["\uFEFFlift_inch,flow_lps\r\n0.2,60\r\n", { lift: "in", flow: "L/s" }],
  ])("recognises %j", (text, units) => expect(accepted(parseFlowCsv(text)).units).toEqual(units));
  it("picks the delimiter from the first line", () => {
    expect(detectDelimiter("# c\nlift_mm;flow_cfm\n")).toBe(";");
    expect(detectDelimiter("a\tb")).toBe("\t");
    expect(detectDelimiter("a,b")).toBe(",");
  });
});

describe("malformed files: per-row errors, nothing accepted", () => {
  it("reports every bad row of the malformed fixture with its line and column", () => {
    const r = refused(parseFlowCsv(fixture("malformed.csv")));
    expect(r.errors).toEqual([
      { row: 3, column: "flow_cfm", message: '"abc" is not a number' },
      { row: 4, column: "lift_in", message: "lift must be greater than zero" },
      { row: 5, column: "flow_cfm", message: "missing flow" },
      { row: 6, column: "lift_in", message: "lift 0.1 already measured on line 2" },
    ]);
    expect("rows" in r).toBe(false);
  });
  it("unknown headers name what was found and what is expected", () => {
    const r = refused(parseFlowCsv(fixture("unknown-headers.csv")));
    expect(r.headers).toEqual(["L", "Q", "remark"]);
    expect(r.errors.map((e) => e.row)).toEqual([1, 1]);
    expect(r.errors[0].message).toContain("lift_in or lift_mm");
  });
  it("a column without unit, an unknown unit, two flow columns", () => {
    expect(refused(parseFlowCsv("lift,flow_cfm\n1,2\n")).errors[0].message).toContain("names no unit");
    expect(refused(parseFlowCsv("lift_ft,flow_cfm\n1,2\n")).errors[0].message).toContain('unknown unit "ft"');
    expect(refused(parseFlowCsv("lift_mm,flow_cfm,flow_ls\n1,2,3\n")).errors[0].message).toContain("two flow columns");
  });
  it("numbers must be plain decimals", () => {
    for (const bad of ["1.2.3", "0x10", "12 mm", "Infinity", "1e999"]) {
      expect(refused(parseFlowCsv(`lift_mm,flow_cfm\n${bad},100\n`)).errors[0]).toMatchObject({ row: 2, column: "lift_mm" });
    }
    expect(accepted(parseFlowCsv("lift_mm,flow_cfm\n.5,1e2\n")).rows[0]).toMatchObject({ lift: 0.5, flow: 100 });
  });
  it("a decimal comma is refused in a comma-delimited file (it would split the cell)", () => {
    const r = refused(parseFlowCsv('lift_mm,flow_cfm\n"2,5",100\n'));
    expect(r.errors[0]).toMatchObject({ row: 2, column: "lift_mm" });
  });
  it("empty file, header only, too many rows", () => {
    expect(refused(parseFlowCsv("")).errors[0].message).toBe("the file is empty");
    expect(refused(parseFlowCsv("lift_mm,flow_cfm\n\n")).errors[0].message).toBe("no data rows after the header");
    const big = ["lift_mm,flow_cfm", ...Array.from({ length: MAX_POINTS + 1 }, (_, i) => `${i + 1},${i}`)].join("\n");
    expect(refused(parseFlowCsv(big)).errors[0].row).toBe(MAX_POINTS + 2);
  });
});

describe("column mapping override", () => {
  it("maps unknown headers by name and by index", () => {
    const r = accepted(
      parseFlowCsv(fixture("unknown-headers.csv"), { lift: { column: "L", unit: "in" }, flow: { column: 1, unit: "cfm" } }),
    );
    expect(r.columns).toEqual({ lift: "L", flow: "Q" });
    expect(r.rows.map((row) => row.flow)).toEqual([68, 128.5]);
  });
  it("reads a file without a header by index", () => {
    const r = accepted(
      parseFlowCsv("0.1,68\n0.2,128\n", { hasHeader: false, lift: { column: 0, unit: "in" }, flow: { column: 1, unit: "cfm" } }),
    );
    expect(r.rows).toEqual([
      { line: 1, lift: 0.1, flow: 68 },
      { line: 2, lift: 0.2, flow: 128 },
    ]);
  });
  it("refuses a mapping to a missing column, a name without header, one column twice", () => {
    const text = "L,Q\n1,2\n";
    expect(refused(parseFlowCsv(text, { lift: { column: "X", unit: "mm" }, flow: { column: "Q", unit: "cfm" } })).errors[0].message).toContain('no column "X"');
    expect(refused(parseFlowCsv(text, { lift: { column: 5, unit: "mm" }, flow: { column: "Q", unit: "cfm" } })).errors[0].message).toContain("#5");
    expect(
      refused(parseFlowCsv("1,2\n", { hasHeader: false, lift: { column: "L", unit: "mm" }, flow: { column: 1, unit: "cfm" } })).errors[0].message,
    ).toContain("by column index");
    expect(refused(parseFlowCsv(text, { lift: { column: 0, unit: "mm" }, flow: { column: "L", unit: "cfm" } })).errors[0].message).toContain("two quantities");
  });
});

describe("flowTestFromCsv", () => {
  it("feeds computeFlowTest, converting per-row depressions to the test's unit", () => {
    const imported = accepted(parseFlowCsv("lift_mm,flow_cfm,depression_kpa\n12.7,205,5.47996\n"));
    const input = flowTestFromCsv(imported, { valveDiameter: 45.72, depression: 28 });
    expect(input.points[0].depression).toBeCloseTo(5479.96 / 249.08891, 6); // kPa → conventional inH2O (NIST SP 811)
    const result = computeFlowTest(input);
    expect(result.points[0].flowCfmAt28).toBeCloseTo(205 * Math.sqrt(6974.489 / 5479.96), 2); // Q ∝ √ΔP, domain.md §2
  });
});
