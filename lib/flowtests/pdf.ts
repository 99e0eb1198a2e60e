/**
 * The flow sheet as a PDF (pdfkit). The document is a readable stream: the route hands it to the
 * response as it is written, nothing is buffered whole. The same facts as the screen (sheet.ts).
 * Built-in PDF fonts only know the Windows-1252 characters, so text passes through `pdfText`.
 */
import PDFDocument from "pdfkit";
import type { FlowTestDetail } from "@/db/queries/flow-tests";
import type { FlowTestResult } from "@/lib/flow";
import { niceStep } from "./axis";
import { flowSheet, type SheetFact } from "./sheet";

export { niceStep };
import { fixed } from "./words";

const INK = "#23211f";
const SOFT = "#57524b";
const FAINT = "#8a8379";
const COPPER = "#b0592d";
const RULE = "#ddd5c7";
const WASH = "#f8ecd0";
const WARN = "#8a5a00";

const MARGIN = 40;

/** Characters beyond Latin-1 that Windows-1252 (the standard fonts' encoding) still has. */
const WIN_ANSI_EXTRA = new Set([..."€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ"]);
const REPLACEMENTS: Record<string, string> = {
  "₂": "2",
  "₀": "0",
  "√": "sqrt",
  "≈": "~",
  "≤": "<=",
  "≥": ">=",
  "→": "->",
  "ρ": "rho",
  "Δ": "d",
  "π": "pi",
  "ε": "epsilon",
  "κ": "kappa",
  "−": "-",
  "∝": "prop. to",
  "\u2009": " ",
  "\u202f": " ",
};

/** Text the built-in fonts can draw: known symbols spelled out, anything else outside Windows-1252 as "?". */
export function pdfText(text: string): string {
  let out = "";
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (REPLACEMENTS[ch] !== undefined) out += REPLACEMENTS[ch];
    else if ((code >= 0x20 && code <= 0x7e) || (code >= 0xa0 && code <= 0xff) || WIN_ANSI_EXTRA.has(ch) || ch === "\n") out += ch;
    else out += "?";
  }
  return out;
}

type Doc = InstanceType<typeof PDFDocument>;

export type PdfOptions = { generatedAt: Date; generatedBy: string };

export function flowSheetPdf(test: FlowTestDetail, result: FlowTestResult, options: PdfOptions): Doc {
  const sheet = flowSheet(test, result);
  const doc = new PDFDocument({
    size: "A4",
    margin: MARGIN,
    info: { Title: pdfText(`${sheet.title} - ${sheet.subtitle}`), Author: pdfText(options.generatedBy), Creator: "Portolan" },
  });
  const width = doc.page.width - 2 * MARGIN;
  const bottom = () => doc.page.height - MARGIN - 18;
  let pageNo = 1;

  const footer = () => {
    const keep = doc.page.margins.bottom;
    // Writing below the bottom margin would open a new page; lift the margin for the footer line.
    doc.page.margins.bottom = 0;
    doc
      .font("Helvetica")
      .fontSize(7.5)
      .fillColor(FAINT)
      .text(
        pdfText(`Portolan flow sheet · ${sheet.title} · generated ${options.generatedAt.toISOString().slice(0, 16).replace("T", " ")} UTC for ${options.generatedBy} · page ${pageNo}`),
        MARGIN,
        doc.page.height - MARGIN + 8,
        { width, lineBreak: false },
      );
    doc.page.margins.bottom = keep;
    doc.x = MARGIN;
    doc.y = MARGIN;
  };
  const newPage = () => {
    doc.addPage();
    pageNo++;
    footer();
  };
  const ensure = (height: number) => {
    if (doc.y + height > bottom()) newPage();
  };
  const heading = (text: string) => {
    ensure(40);
    doc.moveDown(0.6);
    doc.font("Helvetica-Bold").fontSize(9).fillColor(SOFT).text(pdfText(text.toUpperCase()), MARGIN, doc.y, { characterSpacing: 0.6 });
    const y = doc.y + 2;
    doc.moveTo(MARGIN, y).lineTo(MARGIN + width, y).lineWidth(0.5).strokeColor(RULE).stroke();
    doc.y = y + 5;
  };
  const facts = (items: SheetFact[]) => {
    const labelWidth = 150;
    for (const f of items) {
      doc.font("Helvetica").fontSize(9);
      const valueText = pdfText(f.value);
      const noteText = f.note ? pdfText(f.note) : "";
      const valueHeight = doc.font("Helvetica-Bold").fontSize(9).heightOfString(valueText, { width: width - labelWidth });
      const noteHeight = noteText ? doc.font("Helvetica").fontSize(7.5).heightOfString(noteText, { width: width - labelWidth }) : 0;
      const labelHeight = doc.font("Helvetica").fontSize(9).heightOfString(pdfText(f.label), { width: labelWidth - 8 });
      const h = Math.max(labelHeight, valueHeight + noteHeight) + 3;
      ensure(h);
      const y = doc.y;
      doc.font("Helvetica").fontSize(9).fillColor(SOFT).text(pdfText(f.label), MARGIN, y, { width: labelWidth - 8 });
      doc.font("Helvetica-Bold").fontSize(9).fillColor(INK).text(valueText, MARGIN + labelWidth, y, { width: width - labelWidth });
      if (noteText) doc.font("Helvetica").fontSize(7.5).fillColor(FAINT).text(noteText, MARGIN + labelWidth, doc.y, { width: width - labelWidth });
      doc.y = Math.max(doc.y, y + h);
    }
  };

  // ─── Title ───
  footer();
  doc.font("Helvetica-Bold").fontSize(18).fillColor(INK).text(pdfText(sheet.title), MARGIN, MARGIN);
  doc.font("Helvetica").fontSize(10).fillColor(SOFT).text(pdfText(sheet.subtitle));
  doc.moveTo(MARGIN, doc.y + 4).lineTo(MARGIN + width, doc.y + 4).lineWidth(1.5).strokeColor(COPPER).stroke();
  doc.y += 8;

  heading("What was tested");
  facts(sheet.tested);
  heading("Bench, air and valve");
  facts(sheet.bench);
  heading("Results (corrected to 28 inH2O, standard air)");
  facts(sheet.summary);

  // ─── Chart ───
  heading("Flow against lift");
  ensure(200);
  drawFlowChart(doc, MARGIN, doc.y + 16, width, 170, result);
  doc.y += 196;

  // ─── Table ───
  heading("Lift table and computed columns");
  drawTable(doc, result, width, ensure);

  if (sheet.estimates.length) {
    heading("Estimates (common practice)");
    facts(sheet.estimates);
  }
  heading("Conventions");
  doc.font("Helvetica").fontSize(8).fillColor(SOFT);
  for (const line of sheet.conventions) {
    ensure(doc.heightOfString(pdfText(line), { width }) + 2);
    doc.text(pdfText(line), MARGIN, doc.y, { width });
  }
  if (sheet.warnings.length) {
    heading("Warnings");
    doc.font("Helvetica").fontSize(8.5).fillColor(WARN);
    for (const w of sheet.warnings) {
      ensure(doc.heightOfString(pdfText(w), { width }) + 2);
      doc.text(pdfText(w), MARGIN, doc.y, { width });
    }
  }
  if (test.notes) {
    heading("Notes");
    doc.font("Helvetica").fontSize(9).fillColor(INK);
    ensure(doc.heightOfString(pdfText(test.notes), { width }) + 2);
    doc.text(pdfText(test.notes), MARGIN, doc.y, { width });
  }

  // ─── Caution ───
  doc.moveDown(0.8);
  const cautionText = sheet.cautions.map(pdfText).join("\n");
  doc.font("Helvetica").fontSize(8.5);
  const boxHeight = doc.heightOfString(cautionText, { width: width - 20 }) + 30;
  ensure(boxHeight);
  const top = doc.y;
  doc.rect(MARGIN, top, width, boxHeight).fillAndStroke(WASH, WARN);
  doc.font("Helvetica-Bold").fontSize(9.5).fillColor(WARN).text("Caution", MARGIN + 10, top + 8, { width: width - 20 });
  doc.font("Helvetica").fontSize(8.5).fillColor(INK).text(cautionText, MARGIN + 10, doc.y + 2, { width: width - 20 });
  doc.y = top + boxHeight;

  doc.end();
  return doc;
}

function drawFlowChart(doc: Doc, x: number, y: number, w: number, h: number, result: FlowTestResult) {
  const pts = result.points;
  const left = x + 42;
  const plotW = w - 52;
  const plotH = h - 28;
  const maxLift = Math.max(...pts.map((p) => p.liftMm));
  const maxFlow = Math.max(...pts.map((p) => p.flowCfmAt28));
  const xStep = niceStep(maxLift);
  const yStep = niceStep(maxFlow);
  const xMax = Math.ceil(maxLift / xStep) * xStep;
  const yMax = Math.ceil(maxFlow / yStep) * yStep;
  const px = (lift: number) => left + (lift / xMax) * plotW;
  const py = (flowCfm: number) => y + plotH - (flowCfm / yMax) * plotH;

  doc.lineWidth(0.4).strokeColor(RULE);
  doc.font("Helvetica").fontSize(7).fillColor(FAINT);
  for (let v = 0; v <= yMax + 1e-9; v += yStep) {
    doc.moveTo(left, py(v)).lineTo(left + plotW, py(v)).stroke();
    doc.text(fixed(v, yStep < 1 ? 1 : 0), x, py(v) - 3, { width: 38, align: "right", lineBreak: false });
  }
  for (let v = 0; v <= xMax + 1e-9; v += xStep) {
    doc.moveTo(px(v), y).lineTo(px(v), y + plotH).stroke();
    doc.text(fixed(v, xStep < 1 ? 1 : 0), px(v) - 15, y + plotH + 4, { width: 30, align: "center", lineBreak: false });
  }
  doc.fillColor(SOFT).fontSize(7.5);
  doc.text("lift, mm", left, y + plotH + 14, { width: plotW, align: "center", lineBreak: false });
  doc.text("cfm at 28 inH2O, standard air", left, y - 14, { width: 200, lineBreak: false });

  doc.lineWidth(1.6).strokeColor(COPPER);
  pts.forEach((p, i) => (i === 0 ? doc.moveTo(px(p.liftMm), py(p.flowCfmAt28)) : doc.lineTo(px(p.liftMm), py(p.flowCfmAt28))));
  doc.stroke();
  doc.fillColor(COPPER);
  for (const p of pts) doc.circle(px(p.liftMm), py(p.flowCfmAt28), 1.8).fill();
  doc.fillColor(INK);
}

const COLUMNS: Array<{ title: string; width: number; value: (p: FlowTestResult["points"][number]) => string }> = [
  { title: "Lift mm", width: 48, value: (p) => fixed(p.liftMm, 2) },
  { title: "Lift in", width: 44, value: (p) => fixed(p.liftIn, 3) },
  { title: "L/D", width: 40, value: (p) => fixed(p.ld, 3) },
  { title: "Depr. inH2O", width: 52, value: (p) => fixed(p.depressionInH2O, 1) },
  { title: "Flow cfm (as tested)", width: 62, value: (p) => fixed(p.flowCfm, 1) },
  { title: "cfm @28", width: 52, value: (p) => fixed(p.flowCfmAt28, 1) },
  { title: "Cd curtain", width: 50, value: (p) => fixed(p.cdCurtain, 3) },
  { title: "Cd valve", width: 48, value: (p) => fixed(p.cdValve, 3) },
  { title: "Cd seat", width: 46, value: (p) => fixed(p.cdSeat, 3) },
  { title: "Ideal v m/s", width: 50, value: (p) => fixed(p.idealVelocityMs, 1) },
  { title: "cfm/in² valve", width: 54, value: (p) => fixed(p.cfmPerSqInValve, 1) },
];

function drawTable(doc: Doc, result: FlowTestResult, width: number, ensure: (h: number) => void) {
  const total = COLUMNS.reduce((s, c) => s + c.width, 0);
  const scale = width / total;
  const rowH = 13;
  const header = () => {
    ensure(rowH * 3);
    const y = doc.y;
    let x = MARGIN;
    doc.font("Helvetica-Bold").fontSize(7).fillColor(SOFT);
    for (const c of COLUMNS) {
      doc.text(pdfText(c.title), x + 2, y, { width: c.width * scale - 4, align: "right" });
      x += c.width * scale;
    }
    doc.y = y + 20;
    doc.moveTo(MARGIN, doc.y - 3).lineTo(MARGIN + width, doc.y - 3).lineWidth(0.5).strokeColor(RULE).stroke();
  };
  header();
  result.points.forEach((p, i) => {
    if (doc.y + rowH > doc.page.height - MARGIN - 18) {
      ensure(rowH * 4);
      header();
    }
    const y = doc.y;
    if (i % 2 === 1) doc.rect(MARGIN, y - 2, width, rowH).fill("#f7f4ee");
    let x = MARGIN;
    doc.font("Helvetica").fontSize(8).fillColor(INK);
    for (const c of COLUMNS) {
      doc.text(c.value(p), x + 2, y, { width: c.width * scale - 4, align: "right", lineBreak: false });
      x += c.width * scale;
    }
    doc.y = y + rowH;
  });
  doc.x = MARGIN;
}
