import type { ByteCursor } from "../bytes";
import { GeometryInputError, type GeometryWarning } from "../errors";
import { GrowableUint32 } from "../growable";
import { bytesToText, parseDecimal, TokenScanner } from "../textScan";
import type { PointCloud } from "../types";
import { MAX_PLY_HEADER, PLY_TYPE_SIZE, parsePlyHeader, type PlyElement, type PlyHeader, type PlyScalarType } from "./plyHeader";
import { findNonFinite } from "./finite";

type ScalarReader = (dv: DataView, offset: number) => number;

function scalarReader(type: PlyScalarType, le: boolean): ScalarReader {
  switch (type) {
    case "int8":
      return (dv, o) => dv.getInt8(o);
    case "uint8":
      return (dv, o) => dv.getUint8(o);
    case "int16":
      return (dv, o) => dv.getInt16(o, le);
    case "uint16":
      return (dv, o) => dv.getUint16(o, le);
    case "int32":
      return (dv, o) => dv.getInt32(o, le);
    case "uint32":
      return (dv, o) => dv.getUint32(o, le);
    case "float32":
      return (dv, o) => dv.getFloat32(o, le);
    case "float64":
      return (dv, o) => dv.getFloat64(o, le);
  }
}

const INDEX_NAMES = new Set(["vertex_indices", "vertex_index"]);

type VertexPlan = { xi: number; yi: number; zi: number };

function vertexPlan(el: PlyElement): VertexPlan {
  const find = (n: string) => el.properties.findIndex((p) => p.kind === "scalar" && p.name === n);
  const plan = { xi: find("x"), yi: find("y"), zi: find("z") };
  if (plan.xi < 0 || plan.yi < 0 || plan.zi < 0) {
    throw new GeometryInputError("bad-header", "PLY header: the vertex element has no x, y and z properties");
  }
  return plan;
}

async function readHeader(cur: ByteCursor): Promise<PlyHeader> {
  for (;;) {
    const header = parsePlyHeader(cur.buf.subarray(cur.pos, cur.end));
    if (header) {
      cur.pos += header.length;
      return header;
    }
    if (!(await cur.more()) || cur.available > MAX_PLY_HEADER) {
      if (cur.available === 0) throw new GeometryInputError("bad-header", "empty file");
      const again = parsePlyHeader(cur.buf.subarray(cur.pos, cur.end));
      if (again) {
        cur.pos += again.length;
        return again;
      }
      throw new GeometryInputError("bad-header", "PLY header: no end_header line");
    }
  }
}

/** Polygon with n corners → n−2 triangles, fanned from the first corner (exact for convex faces). */
function pushFan(out: GrowableUint32, idx: number[], vertexCount: number, faceNo: number): void {
  for (const v of idx) {
    if (!(v >= 0 && v < vertexCount && Number.isInteger(v))) {
      throw new GeometryInputError("bad-index", `PLY face ${faceNo} refers to vertex ${v}, but there are ${vertexCount}`);
    }
  }
  if (idx.length < 3) return;
  out.reserve(3 * (idx.length - 2));
  const d = out.data;
  for (let k = 1; k + 1 < idx.length; k++) {
    d[out.length++] = idx[0];
    d[out.length++] = idx[k];
    d[out.length++] = idx[k + 1];
  }
}

export async function readPly(cur: ByteCursor, scale: number): Promise<PointCloud> {
  const header = await readHeader(cur);
  const vertexEl = header.elements.find((e) => e.name === "vertex");
  if (!vertexEl) throw new GeometryInputError("bad-header", "PLY header: no vertex element");
  const plan = vertexPlan(vertexEl);
  const vertexCount = vertexEl.count;
  const positions = new Float32Array(vertexCount * 3);
  const faceEl = header.elements.find((e) => e.name === "face");
  const faces = faceEl ? new GrowableUint32(faceEl.count * 3) : null;
  const warnings: GeometryWarning[] = [];
  const ctx = { positions, faces, plan, vertexCount, scale };

  if (header.format === "ascii") {
    const sc = new TokenScanner(cur, header.lines + 1);
    for (const el of header.elements) await readAsciiElement(sc, el, el === vertexEl, el === faceEl, ctx);
    if (await sc.nextAsync()) {
      warnings.push({ code: "trailing-data", message: `PLY: data after the last element (line ${sc.line}) was ignored` });
    }
  } else {
    const le = header.format === "binary_little_endian";
    for (const el of header.elements) await readBinaryElement(cur, el, le, el === vertexEl, el === faceEl, ctx);
    const extra = await cur.drain();
    if (extra > 0) warnings.push({ code: "trailing-data", message: `PLY: ${extra} bytes after the last element were ignored` });
  }
  const bad = findNonFinite(positions, vertexCount);
  if (bad >= 0) throw new GeometryInputError("bad-number", `PLY vertex ${bad} has a coordinate that is not a finite number`);
  const format = header.format === "ascii" ? "ply-ascii" : header.format === "binary_little_endian" ? "ply-binary-le" : "ply-binary-be";
  const cloud: PointCloud = { positions, count: vertexCount, format, warnings };
  if (faces && faces.length > 0) cloud.faces = faces.finish();
  return cloud;
}

type Ctx = {
  positions: Float32Array;
  faces: GrowableUint32 | null;
  plan: VertexPlan;
  vertexCount: number;
  scale: number;
};

async function readBinaryElement(cur: ByteCursor, el: PlyElement, le: boolean, isVertex: boolean, isFace: boolean, ctx: Ctx): Promise<void> {
  const props = el.properties;
  const fixed = props.every((p) => p.kind === "scalar");
  if (fixed) {
    const offsets: number[] = [];
    let recSize = 0;
    for (const p of props) {
      offsets.push(recSize);
      recSize += PLY_TYPE_SIZE[(p as { type: PlyScalarType }).type];
    }
    if (isVertex) {
      const { xi, yi, zi } = ctx.plan;
      const type = (i: number) => (props[i] as { type: PlyScalarType }).type;
      await readFixedVertices(cur, el.count, recSize, [offsets[xi], offsets[yi], offsets[zi]], [type(xi), type(yi), type(zi)], le, ctx);
    } else {
      await skipBytes(cur, el.count * recSize, el.name);
    }
    return;
  }
  await readVariableRecords(cur, el, le, isVertex, isFace, ctx);
}

async function skipBytes(cur: ByteCursor, n: number, what: string): Promise<void> {
  let left = n;
  while (left > 0) {
    if (cur.available === 0 && !(await cur.more())) {
      throw new GeometryInputError("truncated", `PLY: the file ends inside the "${what}" element`);
    }
    const take = Math.min(left, cur.available);
    cur.pos += take;
    left -= take;
  }
}

async function readFixedVertices(
  cur: ByteCursor,
  count: number,
  recSize: number,
  offs: number[],
  types: PlyScalarType[],
  le: boolean,
  ctx: Ctx,
): Promise<void> {
  const out = ctx.positions;
  const s = ctx.scale;
  const [ox, oy, oz] = offs;
  const allFloat = types.every((t) => t === "float32");
  const allDouble = types.every((t) => t === "float64");
  const rx = scalarReader(types[0], le);
  const ry = scalarReader(types[1], le);
  const rz = scalarReader(types[2], le);
  let done = 0;
  let w = 0;
  while (done < count) {
    if (!(await cur.fill(recSize))) {
      throw new GeometryInputError("truncated", `PLY: the file ends after ${done} of ${count} vertices`);
    }
    const n = Math.min(count - done, Math.floor(cur.available / recSize));
    const dv = new DataView(cur.buf.buffer, cur.buf.byteOffset + cur.pos, n * recSize);
    // Specialised loops for the common layouts; the generic one calls a reader per value.
    if (allFloat) {
      for (let k = 0, o = 0; k < n; k++, o += recSize) {
        out[w++] = dv.getFloat32(o + ox, le) * s;
        out[w++] = dv.getFloat32(o + oy, le) * s;
        out[w++] = dv.getFloat32(o + oz, le) * s;
      }
    } else if (allDouble) {
      for (let k = 0, o = 0; k < n; k++, o += recSize) {
        out[w++] = dv.getFloat64(o + ox, le) * s;
        out[w++] = dv.getFloat64(o + oy, le) * s;
        out[w++] = dv.getFloat64(o + oz, le) * s;
      }
    } else {
      for (let k = 0, o = 0; k < n; k++, o += recSize) {
        out[w++] = rx(dv, o + ox) * s;
        out[w++] = ry(dv, o + oy) * s;
        out[w++] = rz(dv, o + oz) * s;
      }
    }
    cur.pos += n * recSize;
    done += n;
  }
}

/** Elements with list properties: records have different lengths, so each one is measured first. */
async function readVariableRecords(cur: ByteCursor, el: PlyElement, le: boolean, isVertex: boolean, isFace: boolean, ctx: Ctx): Promise<void> {
  const props = el.properties.map((p) =>
    p.kind === "scalar"
      ? { list: false, size: PLY_TYPE_SIZE[p.type], read: scalarReader(p.type, le), countSize: 0, readCount: scalarReader("uint8", le), itemSize: 0, readItem: scalarReader("uint8", le), index: false }
      : {
          list: true,
          size: 0,
          read: scalarReader("uint8", le),
          countSize: PLY_TYPE_SIZE[p.countType],
          readCount: scalarReader(p.countType, le),
          itemSize: PLY_TYPE_SIZE[p.itemType],
          readItem: scalarReader(p.itemType, le),
          index: isFace && INDEX_NAMES.has(p.name),
        },
  );
  const { xi, yi, zi } = ctx.plan;
  const idx: number[] = [];
  const xyz = [0, 0, 0];
  let done = 0;
  while (done < el.count) {
    const b = cur.buf;
    const dv = new DataView(b.buffer, b.byteOffset, b.byteLength);
    const end = cur.end;
    let p = cur.pos;
    while (done < el.count) {
      let q = p;
      let complete = true;
      idx.length = 0;
      for (let k = 0; k < props.length; k++) {
        const pr = props[k];
        if (!pr.list) {
          if (q + pr.size > end) {
            complete = false;
            break;
          }
          if (isVertex && (k === xi || k === yi || k === zi)) xyz[k === xi ? 0 : k === yi ? 1 : 2] = pr.read(dv, q);
          q += pr.size;
        } else {
          if (q + pr.countSize > end) {
            complete = false;
            break;
          }
          const n = pr.readCount(dv, q);
          if (!(n >= 0)) throw new GeometryInputError("bad-number", `PLY ${el.name} ${done}: negative list length`);
          q += pr.countSize;
          if (q + n * pr.itemSize > end) {
            complete = false;
            break;
          }
          if (pr.index) for (let j = 0; j < n; j++) idx.push(pr.readItem(dv, q + j * pr.itemSize));
          q += n * pr.itemSize;
        }
      }
      if (!complete) break;
      if (isVertex) {
        const o = 3 * done;
        ctx.positions[o] = xyz[0] * ctx.scale;
        ctx.positions[o + 1] = xyz[1] * ctx.scale;
        ctx.positions[o + 2] = xyz[2] * ctx.scale;
      } else if (isFace && ctx.faces) {
        pushFan(ctx.faces, idx, ctx.vertexCount, done);
      }
      p = q;
      done++;
    }
    cur.pos = p;
    if (done < el.count && !(await cur.more())) {
      throw new GeometryInputError("truncated", `PLY: the file ends after ${done} of ${el.count} "${el.name}" records`);
    }
  }
}

/**
 * Vertices whose properties are all scalars (the usual case): a tight loop over the bytes that
 * parses only x, y and z and merely steps over the other tokens.
 */
async function readAsciiScalarVertices(sc: TokenScanner, el: PlyElement, ctx: Ctx): Promise<void> {
  const np = el.properties.length;
  const want = new Int8Array(np).fill(-1);
  want[ctx.plan.xi] = 0;
  want[ctx.plan.yi] = 1;
  want[ctx.plan.zi] = 2;
  const out = ctx.positions;
  const scale = ctx.scale;
  const cur = sc.cur;
  let rec = 0;
  let k = 0;
  let base = 0;
  while (rec < el.count) {
    const b = cur.buf;
    const lim = sc.limit;
    let i = cur.pos;
    let line = sc.line;
    while (rec < el.count) {
      while (i < lim && b[i] <= 32) {
        if (b[i] === 10) line++;
        i++;
      }
      if (i >= lim) break;
      const start = i;
      while (i < lim && b[i] > 32) i++;
      const w = want[k];
      if (w >= 0) {
        const v = parseDecimal(b, start, i);
        if (v !== v) {
          sc.line = line;
          throw new GeometryInputError("bad-number", `PLY line ${line}: "${bytesToText(b, start, i).slice(0, 40)}" is not a number`);
        }
        out[base + w] = v * scale;
      }
      if (++k === np) {
        k = 0;
        base += 3;
        rec++;
      }
    }
    cur.pos = i;
    sc.line = line;
    if (rec < el.count && !(await sc.refill())) {
      throw new GeometryInputError("truncated", `PLY: the file ends after ${rec} of ${el.count} "${el.name}" records`);
    }
  }
}

async function readAsciiElement(sc: TokenScanner, el: PlyElement, isVertex: boolean, isFace: boolean, ctx: Ctx): Promise<void> {
  const props = el.properties;
  if (props.length === 0 || el.count === 0) return;
  if (isVertex && props.every((p) => p.kind === "scalar")) return readAsciiScalarVertices(sc, el, ctx);
  const { xi, yi, zi } = ctx.plan;
  const out = ctx.positions;
  const s = ctx.scale;
  const idx: number[] = [];
  let rec = 0;
  let k = 0; // property being read within the record
  let listLeft = -1; // items left in the current list, −1 when its count comes next
  let indexList = false;
  let w = 0;
  while (rec < el.count) {
    if (!sc.next()) {
      if (await sc.refill()) continue;
      throw new GeometryInputError("truncated", `PLY: the file ends after ${rec} of ${el.count} "${el.name}" records`);
    }
    const pr = props[k];
    if (pr.kind === "scalar") {
      if (isVertex && (k === xi || k === yi || k === zi)) {
        const v = sc.number();
        if (v !== v) throw new GeometryInputError("bad-number", `PLY line ${sc.line}: "${sc.text()}" is not a number`);
        out[w + (k === xi ? 0 : k === yi ? 1 : 2)] = v * s;
      }
      k++;
    } else if (listLeft < 0) {
      const n = sc.number();
      if (!(n >= 0) || !Number.isInteger(n)) throw new GeometryInputError("bad-number", `PLY line ${sc.line}: bad list length "${sc.text()}"`);
      listLeft = n;
      indexList = isFace && INDEX_NAMES.has(pr.name);
      idx.length = 0;
      if (n === 0) {
        listLeft = -1;
        k++;
      }
    } else {
      if (indexList) {
        const v = sc.number();
        if (v !== v) throw new GeometryInputError("bad-number", `PLY line ${sc.line}: "${sc.text()}" is not a vertex index`);
        idx.push(v);
      }
      if (--listLeft === 0) {
        listLeft = -1;
        k++;
      }
    }
    if (k === props.length) {
      if (isFace && ctx.faces && idx.length > 0) pushFan(ctx.faces, idx, ctx.vertexCount, rec);
      if (isVertex) w += 3;
      k = 0;
      idx.length = 0;
      rec++;
    }
  }
}
