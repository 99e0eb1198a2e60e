/**
 * The parser edge cases listed in the engineering notes §10, one by one. Sources: RS274/NGC v3
 * (NISTIR 6556) §3.1 (% delimiters), §3.3 (line format), §3.4 (modal groups), §3.5.3 (arcs),
 * §3.6.1 (M2/M30), Table 8 (order of execution); ISO 6983-1 for `/`, `%` and O numbers [M in
 * the notes]; the RepRap G-code wiki for `*nn` checksums; LinuxCNC's docs for `;` comments.
 */
import { describe, expect, it } from "vitest";
import { analyzeToolpathText } from "@/lib/toolpath/analyze";
import { PreviewDecimator } from "@/lib/toolpath/decimate";
import { Interpreter } from "@/lib/toolpath/interpreter";
import { LimitChecker } from "@/lib/toolpath/limits";
import { BlockScanner } from "@/lib/toolpath/scanner";
import { WarningLog } from "@/lib/toolpath/warnings";
import { START, analyzeLines, expectNear, warningCodes } from "./helpers";

const SETUP = [START, "T1 M6", "S10000 M3", "G0 X0 Y0 Z0"];
const END = ["M2"];
const program = (...body: string[]) => [...SETUP, ...body, ...END];

describe("1. letters in either case, outside comments", () => {
  it("lower case gives the same result as upper case", () => {
    const upper = analyzeLines(program("G1 X10 Y5 Z-2 F600", "G2 X20 Y5 I5 J0"));
    const lower = analyzeLines(program("g1 x10 y5 z-2 f600", "g2 x20 y5 i5 j0"));
    expect(lower.feedLengthMm).toBe(upper.feedLengthMm);
    expect(lower.feedTimeS).toBe(upper.feedTimeS);
    expect(lower.bounds).toEqual(upper.bounds);
  });

  it("words inside a comment are not run", () => {
    const r = analyzeLines(program("G1 X10 F600 (G0 X999 Y999)"));
    expect(r.bounds.X!.max).toBe(10);
    expect(r.bounds.Y!.max).toBe(0);
  });
});

describe("2. blanks and tabs anywhere (§3.3)", () => {
  it("`G0X +0. 12 34Y 7` means G0 X0.1234 Y7", () => {
    const r = analyzeLines(program("G0X +0. 12 34Y 7"));
    expect(r.bounds.X!.max).toBe(0.1234);
    expect(r.bounds.Y!.max).toBe(7);
    expect(r.warnings).toEqual([]);
  });

  it("tabs count as blanks, also between letter and number", () => {
    const r = analyzeLines(program("G1\tX\t12.5\tY -\t3 F 600"));
    expect(r.bounds.X!.max).toBe(12.5);
    expect(r.bounds.Y!.min).toBe(-3);
  });
});

describe("3. signs, bare decimal points, no exponents, near-integers", () => {
  it("`X.5`, `Y5.`, `Z+1` and `A-.25` read as 0.5, 5, 1 and −0.25", () => {
    const r = analyzeLines(program("G0 X.5 Y5. Z+1 A-.25"));
    expect(r.bounds.X!.max).toBe(0.5);
    expect(r.bounds.Y!.max).toBe(5);
    expect(r.bounds.Z!.max).toBe(1);
    expect(r.bounds.A!.min).toBe(-0.25);
  });

  it("numbers are exact decimals (integer ÷ 10^k): 0.1 + 0.2 is written 0.3", () => {
    const r = analyzeLines(program("G0 X0.3"));
    expect(r.bounds.X!.max).toBe(0.3);
  });

  it("long numbers read exactly: 9 digits, 10 and more, and blanks inside a long one", () => {
    // Parsed as Number() parses the same decimal text (ECMA-262 StringToNumber, correctly rounded).
    const r = analyzeLines(program("G0 X123456.789 Y-1234567.8901 Z0.000000000012 A1 2345 6789.01"));
    expect(r.bounds.X!.max).toBe(Number("123456.789"));
    expect(r.bounds.Y!.min).toBe(Number("-1234567.8901"));
    expect(r.bounds.Z!.max).toBe(Number("0.000000000012"));
    expect(r.bounds.A!.max).toBe(Number("123456789.01"));
  });

  it("an exponent is not a number format in v3: `X1e3` is X1 and an unsupported E word, reported", () => {
    const r = analyzeLines(program("G0 X1e3"));
    expect(r.bounds.X!.max).toBe(1);
    expect(warningCodes(r)).toContain("unsupported-word");
  });

  it("code numbers within 0.0001 of a whole number are accepted; further off is refused", () => {
    const ok = analyzeLines(program("M3.00005", "G1.00001 X4 F600"));
    expect(ok.bounds.X!.max).toBe(4);
    const bad = analyzeLines(program("M3.01", "G1 X4 F600"));
    expect(warningCodes(bad)).toContain("malformed-block");
  });
});

describe("4. N line numbers: missing, repeated or unordered", () => {
  it("have no effect, and warnings name the physical line, not N", () => {
    const plain = analyzeLines(program("G1 X1 F600", "X2", "X3"));
    const numbered = analyzeLines(program("N30 G1 X1 F600", "N10 X2", "N10 X3"));
    expect(numbered.feedLengthMm).toBe(plain.feedLengthMm);
    const withFault = analyzeLines(["N100 G21 G90", "N100 T1 M6", "N5 G0 X0 Y0 Z0", "N7 G1 X1.2.3"]);
    expect(withFault.warnings.find((w) => w.code === "malformed-number")!.line).toBe(4);
  });
});

describe("5. `/` block delete", () => {
  const lines = program("G1 X10 F600", "/G1 X50", "G1 Y10");
  it("with the switch off (default) the line runs", () => {
    const r = analyzeLines(lines);
    expect(r.bounds.X!.max).toBe(50);
    expect(r.blockDeleteLines).toBe(1);
  });
  it("with the switch on the line is skipped", () => {
    const r = analyzeLines(lines, { blockDelete: true });
    expect(r.bounds.X!.max).toBe(10);
    expect(r.blockDeleteLines).toBe(1);
  });
});

describe("6. comments", () => {
  it("( … ) and ; comments are skipped; `;` inside parentheses does not start one", () => {
    const r = analyzeLines(program("G1 X5 F600 (go ; right) Y3", "G1 X7 ; Y99"));
    expect(r.bounds.X!.max).toBe(7);
    expect(r.bounds.Y!.max).toBe(3);
  });
  it("an unclosed comment is reported", () => {
    const r = analyzeLines(program("G1 X5 F600 (never closed"));
    expect(warningCodes(r)).toContain("unclosed-comment");
    expect(r.bounds.X!.max).toBe(5);
  });
  it("comments do not nest: `(a (b) X9)` ends at the first `)`, leaving a stray `)` that voids the line", () => {
    const r = analyzeLines(program("G0 (a (b) X9)"));
    expect(warningCodes(r)).toContain("bad-character");
    expect(r.bounds.X!.max).toBe(0);
  });
});

describe("7. % delimiters (§3.1)", () => {
  it("a leading % makes the program end at the next % line; what follows is reported and not run", () => {
    const r = analyzeLines(["%", ...SETUP, "G1 X10 F600", "%", "G1 X500"]);
    expect(r.bounds.X!.max).toBe(10);
    expect(warningCodes(r)).toContain("text-after-end");
    expect(warningCodes(r)).not.toContain("no-program-end");
  });
  it("an unclosed % is reported", () => {
    const r = analyzeLines(["%", ...SETUP, "G1 X10 F600"]);
    expect(warningCodes(r)).toContain("unclosed-percent");
  });
  it("a program with neither M2/M30 nor % is reported as possibly incomplete", () => {
    const r = analyzeLines([...SETUP, "G1 X10 F600"]);
    expect(warningCodes(r)).toContain("no-program-end");
  });
  it("a % line that is not the first is stray", () => {
    const r = analyzeLines([...SETUP, "%", "G1 X10 F600", "M2"]);
    expect(warningCodes(r)).toContain("stray-percent");
  });
});

describe("8. *nn checksums (3D-printer host protocol, not NGC)", () => {
  const withChecksum = (body: string) => {
    let x = 0;
    for (const ch of body) x ^= ch.charCodeAt(0);
    return `${body}*${x}`;
  };
  it("a matching checksum is verified and stripped", () => {
    const r = analyzeLines(program(withChecksum("N3 G1 X8 F600")));
    expect(r.bounds.X!.max).toBe(8);
    expect(warningCodes(r)).toContain("checksum-stripped");
  });
  it("a wrong checksum skips the line", () => {
    const r = analyzeLines(program("N3 G1 X8 F600*1"));
    expect(r.bounds.X!.max).toBe(0);
    expect(warningCodes(r)).toContain("checksum-mismatch");
  });
});

describe("9. O words", () => {
  it("an O program number is tolerated", () => {
    const r = analyzeLines(["O1234 (PART)", ...program("G1 X3 F600")]);
    expect(r.warnings).toEqual([]);
    expect(r.bounds.X!.max).toBe(3);
  });
  it("O-word subroutines and flow control are refused with a warning", () => {
    const r = analyzeLines(program("o100 sub", "G1 X3 F600", "o100 endsub", "O<probe> call"));
    expect(r.warningCounts["subroutine-not-supported"]).toBe(3);
  });
});

describe("10. parameters and expressions are reported, never half-evaluated", () => {
  it("`#3=6` and `G1 X#3` and `X[1+2]` give warnings and no move", () => {
    const r = analyzeLines(program("#3=6", "G1 X#3 F600", "G1 X[1+2]"));
    expect(r.warningCounts["parameters-not-supported"]).toBe(3);
    expect(r.bounds.X!.max).toBe(0);
  });
});

describe("11. word order and per-line rules (§3.4)", () => {
  it("any word order, many words per line", () => {
    const a = analyzeLines(program("F600 Y4 X3 G1"));
    const b = analyzeLines(program("G1 X3 Y4 F600"));
    expect(a.feedLengthMm).toBe(5);
    expect(b.feedLengthMm).toBe(5);
  });
  it("two G codes of one modal group make the line invalid", () => {
    const r = analyzeLines(program("G0 G1 X9"));
    expect(warningCodes(r)).toContain("modal-conflict");
    expect(r.bounds.X!.max).toBe(0);
  });
  it("a repeated letter (other than G and M) makes the line invalid", () => {
    const r = analyzeLines(program("G1 X1 X2 F600"));
    expect(warningCodes(r)).toContain("repeated-word");
    expect(r.bounds.X!.max).toBe(0);
  });
  it("two M codes of one group (M3 M4) make the line invalid; M7 with M8 is allowed", () => {
    expect(warningCodes(analyzeLines(program("M3 M4")))).toContain("modal-conflict");
    expect(warningCodes(analyzeLines(program("M7 M8")))).not.toContain("modal-conflict");
  });
  it("G28 with G1 on one line: both would use the axis words", () => {
    const r = analyzeLines(program("G28 G1 X5"));
    expect(warningCodes(r)).toContain("modal-conflict");
  });
});

describe("12. modal motion", () => {
  it("a bare axis line repeats the motion mode", () => {
    const r = analyzeLines(program("G1 X10 F600", "X20", "Y10"));
    expectNear(r.feedLengthMm, 30);
    expect(r.motionBlocks).toBe(4); // G0 of the setup + three feed moves
  });

  it("M2 and M30 reset the motion mode to G1, not G0 (§3.6.1)", () => {
    const log = new WarningLog();
    const limits = new LimitChecker(undefined, undefined);
    const interpreter = new Interpreter({ limits, preview: new PreviewDecimator(100), log });
    const scanner = new BlockScanner(interpreter, log, false);
    scanner.push(new TextEncoder().encode("G21 G91 G18 G93\nG0 X1\nM30\n"));
    expect(interpreter.motion).toBe(10); // G1
    expect(interpreter.incremental).toBe(false); // G90
    expect(interpreter.plane).toBe(0); // G17
    expect(interpreter.inverseTime).toBe(false); // G94
    expect(interpreter.programEnded).toBe(true);
  });

  it("axis words with no motion mode yet are reported and do not move", () => {
    const r = analyzeLines([START, "X5"]);
    expect(warningCodes(r)).toContain("axis-words-without-motion");
    expect(r.bounds.X).toBeUndefined();
  });
});

describe("13. arc end point off the radius (§3.5.3.2: 0.002 mm)", () => {
  it("0.003 mm off is reported (v3 calls it an error; LinuxCNC would accept it)", () => {
    const r = analyzeLines(program("G0 X10 Y0", "G2 X0 Y-10.003 I-10 J0 F600"));
    expect(warningCodes(r)).toContain("arc-radius-mismatch");
  });
  it("0.0015 mm off is within the tolerance", () => {
    const r = analyzeLines(program("G0 X10 Y0", "G2 X0 Y-10.0015 I-10 J0 F600"));
    expect(warningCodes(r)).not.toContain("arc-radius-mismatch");
  });
  it("in inch the tolerance is 0.0002 in", () => {
    const bad = analyzeLines([...program("G20", "G0 X1 Y0", "G2 X0 Y-1.0003 I-1 J0 F20")]);
    expect(warningCodes(bad)).toContain("arc-radius-mismatch");
    const ok = analyzeLines([...program("G20", "G0 X1 Y0", "G2 X0 Y-1.0001 I-1 J0 F20")]);
    expect(warningCodes(ok)).not.toContain("arc-radius-mismatch");
  });
  it("an R arc that cannot reach its end point is reported; a full circle with R is refused", () => {
    expect(warningCodes(analyzeLines(program("G2 X30 Y0 R10 F600")))).toContain("arc-radius-too-small");
    expect(warningCodes(analyzeLines(program("G2 X0 Y0 R10 F600")))).toContain("arc-full-circle-with-r");
  });
});

describe("14. line ends and line length", () => {
  const body = program("G1 X10 F600", "", "   ", "G2 X20 Y0 I5 J0", "Y10");
  const text = body.join("\n") + "\n";
  it("LF, CRLF and CR give the same analysis; blank lines are ignored", () => {
    const lf = analyzeToolpathText(text).report;
    const crlf = analyzeToolpathText(text.replace(/\n/g, "\r\n")).report;
    const cr = analyzeToolpathText(text.replace(/\n/g, "\r")).report;
    for (const other of [crlf, cr]) {
      expect(other.lines).toBe(lf.lines);
      expect(other.blocks).toBe(lf.blocks);
      expect(other.feedLengthMm).toBe(lf.feedLengthMm);
      expect(other.bounds).toEqual(lf.bounds);
      expect(other.warnings).toEqual(lf.warnings);
    }
    expect(lf.lines).toBe(body.length);
    expect(lf.blocks).toBe(body.length - 2);
  });
  it("a line over 256 characters is read but reported", () => {
    const r = analyzeLines(program(`G1 X10 F600 (${"c".repeat(260)})`));
    expect(warningCodes(r)).toContain("line-over-256");
    expect(r.bounds.X!.max).toBe(10);
  });
});

describe("15. order of execution within a line (Table 8), not text order", () => {
  it("`G1 X10 F600 G21` after G20 moves 10 mm at 600 mm/min", () => {
    const r = analyzeLines([...SETUP, "G20", "G1 X10 F600 G21", "M2"]);
    expect(r.bounds.X!.max).toBe(10);
    expectNear(r.feedTimeS, 1); // 10 mm / 600 mm/min
    expect(r.units).toBe("mixed");
  });
  it("T and M6 on one line, in either order, change the tool before the move", () => {
    const r = analyzeLines([START, "G0 X0 Y0 Z0", "M6 T7 M3 S9000 G1 X4 F100", "M2"]);
    expect(r.tools.map((t) => t.number)).toEqual([7]);
    expect(r.tools[0].spindleRpm).toEqual({ min: 9000, max: 9000 });
  });
});
