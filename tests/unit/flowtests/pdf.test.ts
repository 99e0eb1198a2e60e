import { describe, expect, it } from "vitest";
import type { FlowTestDetail } from "@/db/queries/flow-tests";
import { computeStored } from "@/lib/flowtests/normalize";
import { flowSheetPdf, niceStep, pdfText } from "@/lib/flowtests/pdf";
import { flowSheet } from "@/lib/flowtests/sheet";

function detail(points: Array<{ liftMm: number; flowCfm: number }>): FlowTestDetail {
  return {
    id: 42,
    subject: "master",
    headTypeId: 1,
    masterId: 3,
    revisionId: null,
    headId: null,
    port: "intake",
    cylinder: 1,
    portNumber: 1,
    depressionInH2O: 28,
    tempC: 20,
    baroKpa: 101.325,
    rhPct: 50,
    valveDiameterMm: 51.31,
    seatIdMm: 46.23,
    minSectionMm2: null,
    entryRadius: true,
    exhaustPipe: false,
    operatorId: 1,
    testedOn: "2025-02-20",
    notes: "Bowl blended; ρ and √ spelled out on paper.",
    createdAt: 0,
    updatedAt: 0,
    castingNumber: "HL-4471-A",
    engineFamily: "Invented V8",
    cylinders: 8,
    boreMm: 101.6,
    strokeMm: 88.39,
    masterLabel: "M-4471-01",
    revisionLabel: null,
    revisionState: null,
    programId: null,
    headSerial: null,
    operatorName: "A porter",
    subjectLabel: "M-4471-01",
    points,
  };
}

async function bytesOf(stream: NodeJS.ReadableStream): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(Buffer.from(chunk as Buffer));
  return Buffer.concat(chunks);
}

const curve = (n: number) => Array.from({ length: n }, (_, i) => ({ liftMm: 0.2 * (i + 1), flowCfm: 20 + 2 * i }));

describe("flow sheet PDF", () => {
  it("writes a PDF that grows to a second page when the lift table is long", async () => {
    const short = detail(curve(10));
    const long = detail(curve(90));
    const pages = async (t: FlowTestDetail) => {
      const c = computeStored(t, t.points);
      if (!c.ok) throw new Error("not computable");
      const bytes = await bytesOf(flowSheetPdf(t, c.result, { generatedAt: new Date(0), generatedBy: "A lead" }));
      expect(bytes.subarray(0, 5).toString()).toBe("%PDF-");
      return bytes.toString("latin1").match(/\/Type \/Page\b/g)?.length ?? 0;
    };
    const shortPages = await pages(short);
    const longPages = await pages(long);
    expect(longPages).toBeGreaterThan(shortPages);
  });

  it("spells out symbols the built-in fonts lack and keeps Windows-1252 ones", () => {
    expect(pdfText("28 inH₂O, ρ ≈ 1.2 kg/m³, 20 °C – √ΔP")).toBe("28 inH2O, rho ~ 1.2 kg/m³, 20 °C – sqrtdP");
    expect(pdfText("日")).toBe("?");
  });

  it("picks round axis steps", () => {
    expect(niceStep(17.3)).toBe(5);
    expect(niceStep(230)).toBe(50);
    expect(niceStep(0.9)).toBe(0.2);
  });

  it("puts the caution, the density law and the compressibility note on the sheet", () => {
    const t = detail(curve(10));
    const c = computeStored(t, t.points);
    if (!c.ok) throw new Error("not computable");
    const sheet = flowSheet(t, c.result);
    expect(sheet.conventions.join(" ")).toMatch(/CIPM-2007/);
    expect(sheet.conventions.join(" ")).toMatch(/Compressibility is neglected/);
    expect(sheet.cautions.join(" ")).toMatch(/flow bench and the inspection decide/);
    // Power rule of thumb (domain.md §8, common practice): 0.257 hp per cfm at 28″ per cylinder.
    const power = sheet.estimates.find((e) => e.label.startsWith("Power"))!;
    expect(power.value).toBe(`about ${(0.257 * c.result.summary.peakFlowCfmAt28 * 8).toFixed(0)} hp for 8 cylinders`);
  });
});

describe("chart axes", () => {
  it("end on the first round value at or above the data", async () => {
    const { niceTicks } = await import("@/lib/flowtests/axis");
    expect(niceTicks(247.8)).toEqual([0, 50, 100, 150, 200, 250]);
    expect(niceTicks(15.24)).toEqual([0, 5, 10, 15, 20]);
    expect(niceTicks(0.297, 6)).toEqual([0, 0.05, 0.1, 0.15, 0.2, 0.25, 0.3]);
    expect(niceTicks(250)).toEqual([0, 50, 100, 150, 200, 250]);
  });
});
