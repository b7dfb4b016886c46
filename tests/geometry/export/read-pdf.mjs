// Reads a PDF with the reference reader (pdfjs-dist legacy build) in its own process and prints JSON:
// per page the page box (pt), the text strings, and the device-space bounding boxes of stroked paths
// (path bounds from pdfjs, mapped through the current transformation matrix it reports).
import { readFileSync } from 'node:fs';
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';

const file = process.argv[2];
const pdf = await getDocument({ data: new Uint8Array(readFileSync(file)), verbosity: 0, disableFontFace: true, useSystemFonts: false }).promise;
const pages = [];
const mul = (a, b) => [
  a[0] * b[0] + a[2] * b[1], a[1] * b[0] + a[3] * b[1],
  a[0] * b[2] + a[2] * b[3], a[1] * b[2] + a[3] * b[3],
  a[0] * b[4] + a[2] * b[5] + a[4], a[1] * b[4] + a[3] * b[5] + a[5],
];
for (let i = 1; i <= pdf.numPages; i++) {
  const page = await pdf.getPage(i);
  const text = await page.getTextContent();
  const ops = await page.getOperatorList();
  const boxes = [];
  let ctm = [1, 0, 0, 1, 0, 0];
  const stack = [];
  for (let k = 0; k < ops.fnArray.length; k++) {
    const fn = ops.fnArray[k];
    const args = ops.argsArray[k];
    if (fn === OPS.save) stack.push(ctm);
    else if (fn === OPS.restore) ctm = stack.pop() ?? [1, 0, 0, 1, 0, 0];
    else if (fn === OPS.transform) ctm = mul(ctm, args);
    else if (fn === OPS.constructPath) {
      const mm = args[args.length - 1];
      if (!mm || mm.length < 4) continue;
      const pts = [[mm[0], mm[1]], [mm[2], mm[1]], [mm[2], mm[3]], [mm[0], mm[3]]].map(([x, y]) => [ctm[0] * x + ctm[2] * y + ctm[4], ctm[1] * x + ctm[3] * y + ctm[5]]);
      const xs = pts.map((p) => p[0]);
      const ys = pts.map((p) => p[1]);
      boxes.push([Math.min(...xs), Math.min(...ys), Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)]);
    }
  }
  pages.push({ view: page.view, texts: text.items.map((t) => t.str).filter((s) => s.length > 0), boxes });
}
process.stdout.write(JSON.stringify({ numPages: pdf.numPages, pages }));
