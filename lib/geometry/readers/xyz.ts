import type { ByteCursor } from "../bytes";
import { GeometryInputError, type GeometryWarning } from "../errors";
import { GrowableFloat32 } from "../growable";
import { bytesToText, parseDecimal } from "../textScan";
import type { PointCloud } from "../types";

/**
 * XYZ / CSV text: one point per line, fields separated by commas, semicolons, spaces or tabs (runs
 * of separators count as one). An optional first line of column names picks the x, y, z columns;
 * otherwise the first three fields are x y z and further fields (normals, intensity) are ignored.
 * Lines starting with # or // are comments.
 */
function isSep(c: number): boolean {
  return c === 44 || c === 59 || c === 32 || c === 9;
}

type Columns = { xi: number; yi: number; zi: number; max: number };

function columnsFromHeader(text: string, warnings: GeometryWarning[]): Columns {
  const names = text
    .trim()
    .split(/[,;\s]+/)
    .map((n) => n.toLowerCase().replace(/^["']/, "").replace(/[^a-z].*$/, ""));
  const xi = names.indexOf("x");
  const yi = names.indexOf("y");
  const zi = names.indexOf("z");
  if (xi < 0 || yi < 0 || zi < 0) {
    warnings.push({ code: "header-columns", message: `XYZ header "${text.trim().slice(0, 60)}" has no x, y, z names: the first three columns are used` });
    return { xi: 0, yi: 1, zi: 2, max: 2 };
  }
  return { xi, yi, zi, max: Math.max(xi, yi, zi) };
}

export async function readXyz(cur: ByteCursor, scale: number, totalBytes: number | undefined): Promise<PointCloud> {
  const out = new GrowableFloat32(totalBytes ? Math.min(Math.ceil(totalBytes / 8), 60_000_000) : 1 << 16);
  const warnings: GeometryWarning[] = [];
  let cols: Columns | null = null;
  let line = 0;
  const xyz = [0, 0, 0];
  await cur.more();
  for (;;) {
    const b = cur.buf;
    let stop = cur.end;
    if (!cur.eof) {
      while (stop > cur.pos && b[stop - 1] !== 10) stop--;
      if (stop === cur.pos) {
        // No complete line in the window yet.
        if (await cur.more()) continue;
        stop = cur.end;
      }
    }
    let p = cur.pos;
    while (p < stop) {
      let e = p;
      while (e < stop && b[e] !== 10) e++;
      const next = e + 1;
      if (e > p && b[e - 1] === 13) e--;
      line++;
      let s = p;
      while (s < e && (b[s] === 32 || b[s] === 9)) s++;
      if (s === e || b[s] === 35 || (b[s] === 47 && b[s + 1] === 47)) {
        p = next;
        continue;
      }
      const c: Columns = cols ?? { xi: 0, yi: 1, zi: 2, max: 2 };
      let field = 0;
      let i = s;
      let ok = true;
      let header = false;
      while (field <= c.max) {
        while (i < e && isSep(b[i])) i++;
        if (i >= e) {
          ok = false;
          break;
        }
        const fs = i;
        while (i < e && !isSep(b[i])) i++;
        if (field === c.xi || field === c.yi || field === c.zi) {
          const v = parseDecimal(b, fs, i);
          if (v !== v) {
            if (cols === null && out.length === 0) {
              // The first line with words is a header naming the columns.
              cols = columnsFromHeader(bytesToText(b, s, e), warnings);
              header = true;
              ok = false;
              break;
            }
            throw new GeometryInputError("bad-number", `XYZ line ${line}: "${bytesToText(b, fs, i).slice(0, 40)}" is not a number`);
          }
          xyz[field === c.xi ? 0 : field === c.yi ? 1 : 2] = v * scale;
        }
        field++;
      }
      if (ok) {
        cols ??= c;
        out.reserve(3);
        const d = out.data;
        d[out.length++] = xyz[0];
        d[out.length++] = xyz[1];
        d[out.length++] = xyz[2];
      } else if (!header) {
        throw new GeometryInputError("bad-number", `XYZ line ${line}: expected at least ${c.max + 1} fields, found ${field}`);
      }
      p = next;
    }
    cur.pos = stop;
    if (cur.eof) break;
    if (!(await cur.more()) && cur.available === 0) break;
  }
  const positions = out.finish();
  return { positions, count: positions.length / 3, format: "xyz", warnings };
}
