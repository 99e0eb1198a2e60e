/**
 * CSV for exports (RFC 4180: comma, CRLF, quotes doubled), written row by row so an export of
 * any length streams. Cells that a spreadsheet would run as a formula (= + - @, tab, CR) are
 * prefixed with an apostrophe: an export must never execute what someone typed into a note.
 */
export type CsvColumn<T> = { header: string; value: (row: T) => string | number | boolean | null | undefined };

const FORMULA_START = /^[=+\-@\t\r]/;

export function csvCell(value: string | number | boolean | null | undefined): string {
  if (value == null) return "";
  let text = typeof value === "string" ? value : String(value);
  if (typeof value === "string" && FORMULA_START.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) || text !== text.trim() ? `"${text.replace(/"/g, '""')}"` : text;
}

export function csvLine(cells: Array<string | number | boolean | null | undefined>): string {
  return `${cells.map(csvCell).join(",")}\r\n`;
}

/** Header line, then one line per row, lazily. */
export function* csvLines<T>(columns: CsvColumn<T>[], rows: Iterable<T>): Generator<string> {
  yield csvLine(columns.map((c) => c.header));
  for (const row of rows) yield csvLine(columns.map((c) => c.value(row)));
}

/** A web ReadableStream of the lines, pulled as the client reads (back-pressure for free). */
export function csvStream(lines: Iterator<string>): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  return new ReadableStream<Uint8Array>({
    pull(controller) {
      // A few hundred lines per pull keeps the chunks reasonable without holding much.
      let chunk = "";
      for (let i = 0; i < 200; i++) {
        const next = lines.next();
        if (next.done) {
          if (chunk) controller.enqueue(encoder.encode(chunk));
          controller.close();
          return;
        }
        chunk += next.value;
      }
      controller.enqueue(encoder.encode(chunk));
    },
  });
}
