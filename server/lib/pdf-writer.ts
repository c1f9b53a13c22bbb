import { PDFDocument, rgb, StandardFonts, type PDFFont, type PDFPage } from 'pdf-lib';

const LETTER: [number, number] = [612, 792];
const MARGIN = 48;

/** A text the standard font can draw: characters outside its set (WinAnsi) become '?' instead of throwing. */
function drawable(font: PDFFont, text: string): string {
  const set = new Set(font.getCharacterSet());
  return [...text.replace(/[\r\n\t]+/g, ' ')].map((ch) => (set.has(ch.codePointAt(0)!) ? ch : '?')).join('');
}

function wrap(font: PDFFont, size: number, text: string, width: number): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/).filter(Boolean)) {
    const next = line ? `${line} ${word}` : word;
    if (line && font.widthOfTextAtSize(next, size) > width) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

/**
 * A top-to-bottom text flow over US Letter pages in the standard Helvetica faces (every PDF reader has them, and
 * text stays searchable), starting a new page when one is full.
 */
export async function createPdfWriter(title: string) {
  const doc = await PDFDocument.create();
  doc.setTitle(title);
  doc.setProducer('Lifeplate');
  doc.setCreator('Lifeplate');
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  let page: PDFPage = doc.addPage(LETTER);
  let y = LETTER[1] - MARGIN;
  const width = LETTER[0] - MARGIN * 2;

  const ensure = (height: number) => {
    if (y - height >= MARGIN) return;
    page = doc.addPage(LETTER);
    y = LETTER[1] - MARGIN;
  };

  function text(value: string, options: { size?: number; bold?: boolean; indent?: number; color?: [number, number, number]; gapAfter?: number } = {}) {
    const size = options.size ?? 10;
    const font = options.bold ? bold : regular;
    const indent = options.indent ?? 0;
    for (const line of wrap(font, size, drawable(font, value), width - indent)) {
      ensure(size * 1.3);
      y -= size * 1.3;
      page.drawText(line, { x: MARGIN + indent, y, size, font, color: rgb(...(options.color ?? [0.1, 0.1, 0.1])) });
    }
    y -= options.gapAfter ?? 2;
  }

  return {
    doc,
    text,
    heading: (value: string, size = 12) => {
      ensure(size * 3);
      y -= 6;
      text(value, { size, bold: true, gapAfter: 3 });
    },
    bullet: (value: string, indent = 10) => text(`- ${value}`, { indent }),
    /** A box drawn around the lines `draw` writes: used for a warning that must be read first. */
    boxed: (draw: () => void) => {
      const top = y;
      const firstPage = page;
      y -= 6;
      draw();
      y -= 6;
      if (page === firstPage) {
        page.drawRectangle({ x: MARGIN - 6, y, width: width + 12, height: top - y, borderColor: rgb(0.7, 0.05, 0.05), borderWidth: 2 });
      }
    },
    image: async (jpeg: Uint8Array, maxWidth: number, caption: string) => {
      const img = await doc.embedJpg(jpeg);
      const scale = Math.min(1, maxWidth / img.width);
      const h = img.height * scale;
      ensure(h + 16);
      y -= h;
      page.drawImage(img, { x: MARGIN, y, width: img.width * scale, height: h });
      text(caption, { size: 8, color: [0.3, 0.3, 0.3], gapAfter: 6 });
    },
    space: (pt: number) => {
      y -= pt;
    },
    save: () => doc.save(),
  };
}

export type PdfWriter = Awaited<ReturnType<typeof createPdfWriter>>;
