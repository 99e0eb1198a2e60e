import { describe, expect, it } from "vitest";
import { checkDeclared, KIND_RULES } from "@/lib/uploads/limits";
import { sniffContent } from "@/lib/uploads/sniff";

const text = (s: string) => new TextEncoder().encode(s);
const bytes = (...b: number[]) => new Uint8Array(b);

/** A binary STL of n triangles: 80-byte header, uint32 LE count, 50 bytes each (STL spec). */
function binaryStl(n: number, header = "solid but binary"): Uint8Array {
  const out = new Uint8Array(84 + 50 * n);
  out.set(text(header));
  new DataView(out.buffer).setUint32(80, n, true);
  return out;
}

describe("sniffContent", () => {
  it("knows images and documents by their signatures", () => {
    expect(sniffContent(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13), 100)).toBe("png");
    expect(sniffContent(bytes(0xff, 0xd8, 0xff, 0xe0), 100)).toBe("jpeg");
    expect(sniffContent(text("GIF89a...."), 10)).toBe("gif");
    expect(sniffContent(text("RIFF\0\0\0\0WEBPVP8 "), 16)).toBe("webp");
    expect(sniffContent(text("%PDF-1.7\n"), 9)).toBe("pdf");
    expect(sniffContent(bytes(0x50, 0x4b, 0x03, 0x04, 1, 2), 6)).toBe("zip");
  });

  it("knows G-code text from a point list", () => {
    const program = "%\nO1101 (SAMPLE)\nG21 G17 G90\nT1 M6\nS14000 M3\nG0 X10. Y-4.5 Z100.\nG1 X12.5 Y-4.0 A-30. B5. F2400\nM30\n%\n";
    expect(sniffContent(text(program), program.length)).toBe("gcode");
    const points = "x,y,z\n1.0,2.0,3.0\n-1.5,2.25,3e1\n";
    expect(sniffContent(text(points), points.length)).toBe("point-text");
    expect(sniffContent(text("1 2 3\n4 5 6\n"), 12)).toBe("point-text");
  });

  it("does not take prose for a program", () => {
    const prose = "Setup notes: clamp the head deck down.\nCheck the dowels.\n";
    expect(sniffContent(text(prose), prose.length)).toBe("text");
  });

  it("knows PLY and both STL forms; binary STL by its exact size even when it starts with 'solid'", () => {
    expect(sniffContent(text("ply\nformat binary_little_endian 1.0\n"), 1000)).toBe("ply");
    const ascii = "solid port\n facet normal 0 0 1\n  outer loop\n";
    expect(sniffContent(text(ascii), ascii.length)).toBe("stl-ascii");
    const stl = binaryStl(3);
    expect(sniffContent(stl, stl.length)).toBe("stl-binary");
    // Same bytes with a size that does not fit 84 + 50n: not an STL.
    expect(sniffContent(stl, stl.length + 1)).not.toBe("stl-binary");
  });

  it("calls NUL-laden data binary and nothing empty", () => {
    expect(sniffContent(bytes(1, 0, 2, 0, 3), 5)).toBe("binary");
    expect(sniffContent(new Uint8Array(0), 0)).toBe("empty");
  });
});

describe("per-kind rules", () => {
  it("refuses a PNG-named-.nc only by content, but a .png toolpath by name", () => {
    expect(checkDeclared("toolpath", "port.nc", 1000)).toBeNull();
    expect(checkDeclared("toolpath", "port.png", 1000)).toMatch(/\.png is not accepted/);
    expect(KIND_RULES.toolpath.accepts).not.toContain("png");
  });

  it("holds each kind to its size ceiling", () => {
    expect(checkDeclared("toolpath", "a.nc", 2 * 1024 ** 3)).toBeNull();
    expect(checkDeclared("toolpath", "a.nc", 2 * 1024 ** 3 + 1)).toMatch(/at most 2 GB/);
    expect(checkDeclared("photo", "a.jpg", 17 * 1024 ** 2)).toMatch(/at most 16 MB/);
    expect(checkDeclared("point_cloud", "a.ply", 0)).toMatch(/empty/);
  });

  it("never accepts uploads of the app's own preview kinds", () => {
    expect(checkDeclared("toolpath_preview", "x.bin", 10)).toMatch(/made by Portolan/);
  });
});
