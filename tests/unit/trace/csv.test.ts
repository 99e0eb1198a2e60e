import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { csvCell, csvLines, csvStream } from "@/lib/trace/csv";
import { recallFileName } from "@/lib/trace/recall";

describe("CSV export", () => {
  const awkward = ['plain', 'has, comma', 'has "quotes"', "two\nlines", " padded ", "", "=SUM(A1)", "+1", "-2", "@me", 42, null, true];

  it("round-trips awkward cells through papaparse (general-purpose CSV reader, RFC 4180)", () => {
    const text = [...csvLines([{ header: "v", value: (r: { v: unknown }) => r.v as string }], awkward.map((v) => ({ v })))].join("");
    const parsed = Papa.parse<string[]>(text, { skipEmptyLines: false });
    const cells = parsed.data.slice(1, 1 + awkward.length).map((r) => r[0]);
    expect(cells).toEqual(["plain", "has, comma", 'has "quotes"', "two\nlines", " padded ", "", "'=SUM(A1)", "'+1", "'-2", "'@me", "42", "", "true"]);
    expect(text.endsWith("\r\n")).toBe(true);
  });

  it("does not disturb numbers, only text that a spreadsheet would run", () => {
    expect(csvCell(-2.5)).toBe("-2.5");
    expect(csvCell("-2.5")).toBe("'-2.5");
    expect(csvCell("J-2026-001")).toBe("J-2026-001");
  });

  it("streams lazily: the stream pulls rows only as it is read", async () => {
    let produced = 0;
    function* rows() {
      for (let i = 0; i < 1000; i++) {
        produced++;
        yield { v: i };
      }
    }
    const stream = csvStream(csvLines([{ header: "v", value: (r: { v: number }) => r.v }], rows()));
    const reader = stream.getReader();
    await reader.read();
    expect(produced).toBeLessThan(1000);
    let text = "";
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      text += new TextDecoder().decode(value);
    }
    expect(produced).toBe(1000);
    expect(text.trim().split("\r\n").at(-1)).toBe("999");
  });

  it("names the recall file after the revision and the day", () => {
    expect(recallFileName("Street intake B", Date.UTC(2026, 11, 4))).toBe("recall-Street-intake-B-2026-12-04.csv");
  });
});
