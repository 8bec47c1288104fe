import "server-only";
import path from "node:path";
import PDFDocument from "pdfkit";
import { BIN_COLOURS } from "@/domain/wafer-map";
import { mapLayout } from "@/domain/wafer-map";
import { REPORT_CAUTIONS } from "@/lib/cautions";
import { formatConductance, formatDate, formatDateTime, formatPercent, formatTemperature } from "@/lib/format";
import type { LotReport } from "./lot-report";

// IBM Plex Sans shipped with the app, embedded in the PDF (the latin subset has no subscript digits: G₀ prints as G0).
const FONT_DIR = path.join(process.cwd(), "node_modules/@fontsource/ibm-plex-sans/files");
const REGULAR = path.join(FONT_DIR, "ibm-plex-sans-latin-400-normal.woff");
const BOLD = path.join(FONT_DIR, "ibm-plex-sans-latin-600-normal.woff");
const INK = "#1b2430";
const MUTED = "#5b6878";
const pdfText = (s: string) => s.replace(/₀/g, "0");

function table(doc: PDFKit.PDFDocument, headers: string[], rows: string[][], widths: number[]): void {
  const x0 = doc.page.margins.left;
  const row = (cells: string[], bold: boolean) => {
    if (doc.y > doc.page.height - doc.page.margins.bottom - 20) doc.addPage();
    const y = doc.y;
    doc.font(bold ? BOLD : REGULAR).fontSize(bold ? 8 : 9).fillColor(bold ? MUTED : INK);
    let x = x0;
    cells.forEach((c, i) => {
      doc.text(pdfText(c), x, y, { width: widths[i]! - 6, lineBreak: false });
      x += widths[i]!;
    });
    doc.y = y + 14;
    doc.moveTo(x0, doc.y - 2).lineTo(x, doc.y - 2).lineWidth(0.3).strokeColor("#d5dbe3").stroke();
  };
  row(headers, true);
  rows.forEach((r) => row(r, false));
  doc.x = x0;
  doc.moveDown(0.8);
}

/** Draws one bin map as vector rectangles: crisp at any zoom and in greyscale print. */
function binMap(doc: PDFKit.PDFDocument, map: LotReport["maps"][number], report: LotReport, x: number, y: number, size: number): void {
  const layout = mapLayout(map.dies, report.product);
  const scale = size / (2 * layout.waferRadiusMm);
  const cx = x + size / 2;
  const cy = y + size / 2;
  doc.circle(cx, cy, layout.waferRadiusMm * scale).lineWidth(0.6).strokeColor(MUTED).stroke();
  map.dies.forEach((die, i) => {
    const r = layout.rects[i]!;
    doc.rect(cx + r.leftMm * scale, cy - (r.bottomMm + r.heightMm) * scale, r.widthMm * scale, r.heightMm * scale).fillColor(BIN_COLOURS[die.bin]).fill();
  });
  doc.font(REGULAR).fontSize(8).fillColor(INK).text(`Wafer ${map.wafer}`, x, y + size + 2, { width: size, align: "center" });
}

/** The lot report as a PDF: the same numbers as the page, with page numbers, the tenant's name and the time. */
export function renderLotReportPdf(report: LotReport, tenantName: string, generatedAt = new Date()): Promise<Buffer> {
  const doc = new PDFDocument({ size: "A4", margin: 48, bufferPages: true, info: { Title: `Lot report ${report.lot}`, Author: tenantName, Creator: "Lotwarden" } });
  const chunks: Buffer[] = [];
  doc.on("data", (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on("end", () => resolve(Buffer.concat(chunks))));
  const unit = report.product.displayUnit;

  doc.font(BOLD).fontSize(9).fillColor(MUTED).text(`${tenantName.toUpperCase()} · LOT REPORT`);
  doc.font(BOLD).fontSize(20).fillColor(INK).text(`Lot ${report.lot}`);
  doc.font(REGULAR).fontSize(10).fillColor(INK).text(`${report.product.code} — ${report.product.name}${report.customer ? ` · for ${report.customer}` : ""}`);
  doc.fillColor(MUTED).text(`Disposition: ${report.status}${report.releasedAt ? ` on ${formatDate(report.releasedAt)}` : ""} · probed ${formatDateTime(report.probedAt)} at ${formatTemperature(report.chuckTemperatureK)}`);
  doc.moveDown();
  const summary: [string, string][] = [
    ["Yield", `${formatPercent(report.yield)} (${report.pass}/${report.tested})`],
    ["Shipped yield", `${formatPercent(report.shippedYield)} (${report.shippedPass}/${report.tested})`],
    ["Median G", formatConductance(report.medianConductanceS, unit)],
    ["Within spec", `${formatPercent(report.withinSpecFraction)} of measured dies`],
    ["Spec window", `${formatConductance(report.product.specLowS, unit)} – ${formatConductance(report.product.specHighS, unit)}`],
  ];
  for (const [k, v] of summary) doc.font(BOLD).fontSize(10).fillColor(INK).text(`${k}: `, { continued: true }).font(REGULAR).text(pdfText(v));
  doc.moveDown();
  doc.font(BOLD).fontSize(12).text("Yield per wafer");
  table(doc, ["Wafer", "Tested", "Pass", "Yield", "Inked", "Shipped yield", "Median G"], report.wafers.map((w) => [String(w.wafer), String(w.tested), String(w.pass), formatPercent(w.yield), String(w.inked), formatPercent(w.shippedYield), formatConductance(w.medianConductanceS, unit)]), [50, 60, 60, 70, 50, 90, 110]);
  doc.font(BOLD).fontSize(12).fillColor(INK).text("Bins");
  table(doc, ["Bin", "Dies", "Share"], report.bins.map((b) => [b.bin, String(b.count), formatPercent(b.fraction)]), [110, 70, 70]);

  doc.addPage();
  doc.font(BOLD).fontSize(12).fillColor(INK).text("Bin wafer maps");
  const size = 150;
  const perRow = 3;
  let top = doc.y + 8;
  report.maps.forEach((m, i) => {
    if (i > 0 && i % perRow === 0) top += size + 24;
    if (top + size + 20 > doc.page.height - doc.page.margins.bottom) {
      doc.addPage();
      top = doc.page.margins.top;
    }
    binMap(doc, m, report, doc.page.margins.left + (i % perRow) * (size + 20), top, size);
  });
  doc.x = doc.page.margins.left;
  doc.y = top + size + 30;
  const legend = Object.entries(BIN_COLOURS).map(([bin]) => bin);
  legend.forEach((bin, i) => {
    const lx = doc.page.margins.left + i * 70;
    doc.rect(lx, doc.y, 8, 8).fillColor(BIN_COLOURS[bin as keyof typeof BIN_COLOURS]).fill();
    doc.font(REGULAR).fontSize(8).fillColor(INK).text(bin, lx + 11, doc.y - 1, { lineBreak: false });
  });
  doc.x = doc.page.margins.left;
  doc.y += 24;
  doc.font(REGULAR).fontSize(8).fillColor(MUTED);
  for (const caution of REPORT_CAUTIONS) doc.text(caution, { width: doc.page.width - 96 }).moveDown(0.3);

  const range = doc.bufferedPageRange();
  for (let i = 0; i < range.count; i++) {
    doc.switchToPage(range.start + i);
    const bottom = doc.page.height - 30;
    doc.font(REGULAR).fontSize(7).fillColor(MUTED);
    doc.text(`${tenantName} · lot ${report.lot} · generated ${formatDateTime(generatedAt)}`, 48, bottom, { lineBreak: false });
    doc.text(`Page ${i + 1} of ${range.count}`, doc.page.width - 148, bottom, { width: 100, align: "right", lineBreak: false });
  }
  doc.end();
  return done;
}
