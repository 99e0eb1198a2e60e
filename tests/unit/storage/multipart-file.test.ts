/**
 * The stand-in's streaming multipart reader. Bodies are encoded by the platform's own
 * FormData serializer (undici's Response, the general-purpose reference) and by hand for
 * near-miss delimiters, then cut into arbitrary chunks, since a delimiter split across chunks is
 * where such parsers go wrong.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { boundaryOf, multipartFileBytes, MultipartError } from "@/storage-fake/multipart-file";

async function* inChunks(bytes: Buffer, cuts: number[]): AsyncGenerator<Uint8Array> {
  const points = [...new Set(cuts.map((c) => c % (bytes.length + 1)))].sort((a, b) => a - b);
  let at = 0;
  for (const p of points) {
    if (p > at) yield bytes.subarray(at, p);
    at = Math.max(at, p);
  }
  if (at < bytes.length) yield bytes.subarray(at);
}

async function extract(body: Buffer, contentType: string, cuts: number[], field = "file") {
  const out: Buffer[] = [];
  let info: unknown;
  for await (const chunk of multipartFileBytes(inChunks(body, cuts), contentType, field, (i) => (info = i))) out.push(chunk);
  return { bytes: Buffer.concat(out), info };
}

async function encodeWithPlatform(fields: Array<[string, string | File]>): Promise<{ body: Buffer; contentType: string }> {
  const form = new FormData();
  for (const [name, value] of fields) form.append(name, value);
  const res = new Response(form);
  return { body: Buffer.from(await res.arrayBuffer()), contentType: res.headers.get("content-type")! };
}

function encodeByHand(boundary: string, parts: Array<{ headers: string[]; body: Buffer }>, preamble = "", epilogue = ""): Buffer {
  const pieces: Buffer[] = [Buffer.from(preamble ? `${preamble}\r\n` : "")];
  for (const p of parts) pieces.push(Buffer.from(`--${boundary}\r\n${p.headers.join("\r\n")}\r\n\r\n`), p.body, Buffer.from("\r\n"));
  pieces.push(Buffer.from(`--${boundary}--\r\n${epilogue}`));
  return Buffer.concat(pieces);
}

describe("multipartFileBytes", () => {
  it("returns the file field's exact bytes for any chunking of a FormData body", async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.uint8Array({ minLength: 0, maxLength: 3000 }),
        fc.array(fc.nat(), { maxLength: 40 }),
        fc.string({ maxLength: 20 }),
        async (content, cuts, note) => {
          const file = new File([content], "scan notes.bin", { type: "application/octet-stream" });
          const { body, contentType } = await encodeWithPlatform([
            ["note", note],
            ["file", file],
            ["after", "x"],
          ]);
          const got = await extract(body, contentType, cuts);
          expect(got.bytes.equals(Buffer.from(content))).toBe(true);
          expect(got.info).toMatchObject({ fieldName: "file", fileName: "scan notes.bin", contentType: "application/octet-stream" });
        },
      ),
      { numRuns: 150 },
    );
  });

  it("does not end the file at near-misses of the delimiter", async () => {
    const boundary = "B0UNDARY42";
    const tricky = Buffer.from(`line\r\n--B0UND\r\n--B0UNDARY4\r\n-B0UNDARY42\r\n--b0undary42\r\n--B0UNDARY4`);
    const body = encodeByHand(boundary, [{ headers: ['Content-Disposition: form-data; name="file"; filename="t.nc"'], body: tricky }], "preamble text", "epilogue");
    await fc.assert(
      fc.asyncProperty(fc.array(fc.nat(), { maxLength: 30 }), async (cuts) => {
        const got = await extract(body, `multipart/form-data; boundary=${boundary}`, cuts);
        expect(got.bytes.toString("latin1")).toBe(tricky.toString("latin1"));
      }),
      { numRuns: 200 },
    );
  });

  it("reads a quoted boundary parameter and one that is not first", () => {
    expect(boundaryOf('multipart/form-data; charset=utf-8; boundary="a b:c"')).toBe("a b:c");
    expect(boundaryOf("multipart/form-data;boundary=xyz")).toBe("xyz");
    expect(() => boundaryOf("application/json")).toThrow(MultipartError);
  });

  it("refuses a body cut off before its closing boundary", async () => {
    const { body, contentType } = await encodeWithPlatform([["file", new File([Buffer.alloc(500, 7)], "a.bin")]]);
    const truncated = body.subarray(0, body.length - 10);
    await expect(extract(truncated, contentType, [100])).rejects.toThrow(/ended before its closing boundary/);
  });

  it("refuses a body without the wanted field", async () => {
    const { body, contentType } = await encodeWithPlatform([["other", new File([Buffer.from("x")], "a.bin")]]);
    await expect(extract(body, contentType, [])).rejects.toThrow(/no "file" field/);
  });

  it("takes the first of two fields with the same name", async () => {
    const { body, contentType } = await encodeWithPlatform([
      ["file", new File([Buffer.from("first")], "1.txt")],
      ["file", new File([Buffer.from("second")], "2.txt")],
    ]);
    expect((await extract(body, contentType, [3, 50, 51])).bytes.toString()).toBe("first");
  });
});
