/**
 * A thin layer over pdfkit that takes millimetres (page y down) and Sheetsmith's draw styles, and
 * collects the finished file into bytes. Colours are Sheetsmith's own: near-black cut lines, teal
 * match marks, rust bevels, violet score lines, plum darts, slate scale squares.
 */
import PDFDocument from 'pdfkit';
import type { PointMm } from '../pattern/pattern-doc';
import type { DrawLine, DrawStyle, DrawText } from './piece-drawing';
import { GeometryError } from '../errors';
import { MARK_COLOURS, MARK_DASHES, MARK_TEXT_COLOURS } from './mark-colours';

/** Points per millimetre: 72 pt per inch (ISO 32000-1 §8.3.2.3), 25.4 mm per inch. */
export const PT_PER_MM = 72 / 25.4;

export interface PdfFonts {
  regular: Uint8Array;
  bold: Uint8Array;
  mono: Uint8Array;
}

export const STYLE_PEN: Readonly<Record<DrawStyle | 'square' | 'align' | 'grid', { color: string; widthPt: number; dash?: readonly number[] }>> = {
  cut: { color: MARK_COLOURS.cut, widthPt: 0.9 },
  match: { color: MARK_COLOURS.match, widthPt: 0.8 },
  bevel: { color: MARK_COLOURS.bevel, widthPt: 0.6 },
  station: { color: MARK_COLOURS.station, widthPt: 1 },
  score: { color: MARK_COLOURS.score, widthPt: 0.8, dash: MARK_DASHES.score },
  dart: { color: MARK_COLOURS.dart, widthPt: 0.8, dash: MARK_DASHES.dart },
  texture: { color: MARK_COLOURS.texture, widthPt: 0.7 },
  square: { color: '#1f4e9a', widthPt: 0.7 },
  align: { color: '#444444', widthPt: 0.6 },
  grid: { color: '#9a9a9a', widthPt: 0.4, dash: [3, 2] },
};

export class PdfCanvas {
  readonly pdf: PDFKit.PDFDocument;
  private readonly chunks: Uint8Array[] = [];
  private readonly done: Promise<void>;

  constructor(fonts: PdfFonts, title: string) {
    for (const [k, v] of Object.entries(fonts)) {
      if (!(v instanceof Uint8Array) || v.length < 100) throw new GeometryError('BAD_OPTION', `font "${k}" is missing or empty: pass the TrueType file's bytes`);
    }
    this.pdf = new PDFDocument({ autoFirstPage: false, margin: 0, info: { Title: title, Creator: 'Sheetsmith' } });
    this.pdf.registerFont('regular', Buffer.from(fonts.regular));
    this.pdf.registerFont('bold', Buffer.from(fonts.bold));
    this.pdf.registerFont('mono', Buffer.from(fonts.mono));
    this.pdf.on('data', (c: Uint8Array) => this.chunks.push(c));
    this.done = new Promise((resolve, reject) => {
      this.pdf.on('end', () => resolve());
      this.pdf.on('error', reject);
    });
  }

  addPage(widthMm: number, heightMm: number): void {
    this.pdf.addPage({ size: [widthMm * PT_PER_MM, heightMm * PT_PER_MM], margin: 0 });
  }

  polyline(points: readonly PointMm[], pen: { color: string; widthPt: number; dash?: readonly number[] }, closed = false, filled = false): void {
    if (points.length < 2) return;
    const p = this.pdf;
    p.save();
    p.lineWidth(pen.widthPt).strokeColor(pen.color).lineJoin('round').lineCap('butt');
    if (pen.dash) p.dash(pen.dash[0], { space: pen.dash[1] });
    p.moveTo(points[0][0] * PT_PER_MM, points[0][1] * PT_PER_MM);
    for (let i = 1; i < points.length; i++) p.lineTo(points[i][0] * PT_PER_MM, points[i][1] * PT_PER_MM);
    if (closed) p.closePath();
    if (filled) p.fillColor(pen.color).fillAndStroke(pen.color, pen.color);
    else p.stroke();
    p.restore();
  }

  /** Draws a styled line given in page mm. */
  line(l: DrawLine, toPage: (p: PointMm) => PointMm): void {
    this.polyline(l.points.map(toPage), STYLE_PEN[l.style], l.closed, l.filled);
  }

  /** Text centred on `at` (page mm), rotated `angleDeg` counter-clockwise as seen on the page. */
  text(str: string, at: PointMm, sizeMm: number, font: 'regular' | 'bold' | 'mono', color = '#1b1b1b', angleDeg = 0): void {
    const p = this.pdf;
    const size = sizeMm * PT_PER_MM;
    p.save();
    p.font(font).fontSize(size).fillColor(color);
    const w = p.widthOfString(str);
    p.translate(at[0] * PT_PER_MM, at[1] * PT_PER_MM);
    if (angleDeg) p.rotate(-angleDeg);
    p.text(str, -w / 2, -size * 0.6, { lineBreak: false });
    p.restore();
  }

  /** Text starting at `at` (page mm, top of the line), wrapped to `widthMm`; returns the height used, mm. */
  para(str: string, at: PointMm, widthMm: number, sizePt: number, font: 'regular' | 'bold' | 'mono' = 'regular', color = '#1b1b1b'): number {
    const p = this.pdf;
    p.font(font).fontSize(sizePt).fillColor(color);
    const opts = { width: widthMm * PT_PER_MM, lineGap: 1 };
    const h = p.heightOfString(str, opts);
    p.text(str, at[0] * PT_PER_MM, at[1] * PT_PER_MM, opts);
    return h / PT_PER_MM;
  }

  drawText(t: DrawText, toPage: (p: PointMm) => PointMm): void {
    this.text(t.text, toPage(t.at), t.sizeMm, t.weight, MARK_TEXT_COLOURS[t.style], t.angleDeg);
  }

  clipRect(leftMm: number, topMm: number, wMm: number, hMm: number): void {
    this.pdf.save();
    this.pdf.rect(leftMm * PT_PER_MM, topMm * PT_PER_MM, wMm * PT_PER_MM, hMm * PT_PER_MM).clip();
  }

  unclip(): void {
    this.pdf.restore();
  }

  /** Finishes the document and returns its bytes. */
  async finish(): Promise<Uint8Array> {
    this.pdf.end();
    await this.done;
    const n = this.chunks.reduce((s, c) => s + c.length, 0);
    const out = new Uint8Array(n);
    let o = 0;
    for (const c of this.chunks) {
      out.set(c, o);
      o += c.length;
    }
    return out;
  }
}

/**
 * Draws the scale check: a 4 in square and a 100 mm square sharing their lower-left corner at
 * (leftMm, bottomMm) on the page, both labelled. Sizes: 100 mm = 283.46 pt and 4 in = 288 pt at
 * 72 pt per inch (ISO 32000-1 §8.3.2.3).
 */
export function drawScaleSquares(c: PdfCanvas, leftMm: number, bottomMm: number): void {
  const p = c.pdf;
  const pen = STYLE_PEN.square;
  p.save();
  p.lineWidth(pen.widthPt).strokeColor(pen.color);
  const x = leftMm * PT_PER_MM;
  const b = bottomMm * PT_PER_MM;
  p.rect(x, b - 4 * 72, 4 * 72, 4 * 72).stroke();
  p.rect(x, b - 100 * PT_PER_MM, 100 * PT_PER_MM, 100 * PT_PER_MM).stroke();
  p.restore();
  c.text('100 mm square: measure each side', [leftMm + 50, bottomMm - 100 + 5], 3, 'bold', pen.color);
  c.text('outer square: 4 in', [leftMm + 50.8, bottomMm - 101.6 - 2.4], 2.6, 'regular', pen.color);
  c.text('if a side is off, reprint at 100 % / actual size', [leftMm + 50, bottomMm - 50], 2.4, 'regular', pen.color);
}

/** Draws an alignment mark centred at `at` (page mm): a circle with a cross and its short code. */
export function drawAlignmentMark(c: PdfCanvas, at: PointMm, code: string): void {
  const r = 2.5;
  const pts: PointMm[] = Array.from({ length: 25 }, (_, i) => [at[0] + r * Math.cos((i * Math.PI) / 12), at[1] + r * Math.sin((i * Math.PI) / 12)]);
  c.polyline(pts, STYLE_PEN.align, true);
  c.polyline([[at[0] - 4, at[1]], [at[0] + 4, at[1]]], STYLE_PEN.align);
  c.polyline([[at[0], at[1] - 4], [at[0], at[1] + 4]], STYLE_PEN.align);
  c.text(code, [at[0] + 5.5, at[1] + 3.2], 1.8, 'mono', '#444444');
}
