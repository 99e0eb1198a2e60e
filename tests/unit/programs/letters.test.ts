import { describe, expect, it } from "vitest";
import { letterToNumber, nextLetter, numberToLetter } from "@/lib/programs/letters";

describe("revision letters", () => {
  it("run A…Z, then AA, AB … like spreadsheet columns", () => {
    expect(numberToLetter(1)).toBe("A");
    expect(numberToLetter(26)).toBe("Z");
    expect(numberToLetter(27)).toBe("AA");
    expect(numberToLetter(52)).toBe("AZ");
    expect(numberToLetter(53)).toBe("BA");
    expect(numberToLetter(702)).toBe("ZZ");
    expect(numberToLetter(703)).toBe("AAA");
  });

  it("round-trips every number up to 2000", () => {
    for (let n = 1; n <= 2000; n++) expect(letterToNumber(numberToLetter(n))).toBe(n);
  });

  it("continues after the highest letter in use, never reusing a gap", () => {
    expect(nextLetter([])).toBe("A");
    expect(nextLetter(["A", "B"])).toBe("C");
    expect(nextLetter(["A", "C"])).toBe("D");
    expect(nextLetter(["Z", "B"])).toBe("AA");
  });

  it("refuses what is not a letter", () => {
    expect(() => letterToNumber("a")).toThrow();
    expect(() => numberToLetter(0)).toThrow();
  });
});
