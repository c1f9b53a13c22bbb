import { decodePDFRawStream, PDFArray, PDFRawStream, type PDFPage } from 'pdf-lib';

/** The text a page shows: pdf-lib writes standard-font text as <hex> Tj operators. */
export function pdfPageText(page: PDFPage): string {
  const contents = page.node.Contents();
  const streams = contents instanceof PDFArray ? contents.asArray().map((r) => page.doc.context.lookup(r)) : [contents];
  let text = '';
  for (const s of streams) {
    if (!(s instanceof PDFRawStream)) continue;
    const ops = Buffer.from(decodePDFRawStream(s).decode()).toString('latin1');
    for (const m of ops.matchAll(/<([0-9A-Fa-f]+)>\s*Tj/g)) text += `${Buffer.from(m[1], 'hex').toString('latin1')}\n`;
  }
  return text;
}
