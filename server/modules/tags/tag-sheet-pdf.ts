import QRCode from 'qrcode';
import { PDFDocument, rgb, StandardFonts, type PDFPage } from 'pdf-lib';
import { formatTagCode } from '../../../shared/tags/tag-code';
import { PT_PER_IN, TAG_FORMATS, tagsPerPage, type TagFormat } from './tag-formats';
import { RECORD_WORDS } from '../../../shared/glossary/words';

export type TagSheetInput = { codes: string[]; baseUrl: string; companyName: string; format: TagFormat['id'] };

export const tagUrl = (baseUrl: string, code: string) => `${baseUrl.replace(/\/$/, '')}/t/${code}`;

/** Draws the QR as vector squares (one rectangle per run of dark modules), so it prints sharp at any size. */
function drawQr(page: PDFPage, text: string, x: number, yTop: number, sizePt: number) {
  const qr = QRCode.create(text, { errorCorrectionLevel: 'M' });
  const n = qr.modules.size;
  const quiet = 2;
  const cell = sizePt / (n + quiet * 2);
  for (let row = 0; row < n; row++) {
    let col = 0;
    while (col < n) {
      if (!qr.modules.get(row, col)) {
        col++;
        continue;
      }
      const start = col;
      while (col < n && qr.modules.get(row, col)) col++;
      page.drawRectangle({
        x: x + (quiet + start) * cell,
        y: yTop - (quiet + row + 1) * cell,
        width: (col - start) * cell,
        height: cell,
        color: rgb(0, 0, 0),
      });
    }
  }
}

function wrap(text: string, fits: (t: string) => boolean): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    const next = line ? `${line} ${word}` : word;
    if (line && !fits(next)) {
      lines.push(line);
      line = word;
    } else line = next;
  }
  if (line) lines.push(line);
  return lines;
}

export async function renderTagSheetPdf(input: TagSheetInput): Promise<Uint8Array> {
  const format = TAG_FORMATS[input.format];
  const doc = await PDFDocument.create();
  doc.setTitle(`Lifeplate tags (${input.codes.length})`);
  doc.setProducer('Lifeplate');
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const perPage = tagsPerPage(format);
  const labelW = format.label_.widthIn * PT_PER_IN;
  const labelH = format.label_.heightIn * PT_PER_IN;
  const large = format.id === 'single_large';

  for (let i = 0; i < input.codes.length; i++) {
    const page = i % perPage === 0 ? doc.addPage([format.page.widthIn * PT_PER_IN, format.page.heightIn * PT_PER_IN]) : doc.getPage(doc.getPageCount() - 1);
    const slot = i % perPage;
    const left = (format.marginLeftIn + (slot % format.columns) * format.pitchXIn) * PT_PER_IN;
    const top = page.getHeight() - (format.marginTopIn + Math.floor(slot / format.columns) * format.pitchYIn) * PT_PER_IN;
    const code = input.codes[i];
    const pad = large ? 12 : 4;
    const qrSize = Math.min(labelH - pad * 2, labelW * 0.42);
    drawQr(page, tagUrl(input.baseUrl, code), left + pad, top - pad, qrSize);
    const textX = left + pad + qrSize + (large ? 10 : 4);
    const textW = labelW - (textX - left) - pad;
    const printed = formatTagCode(code);
    const codeSize = Math.min(large ? 24 : 12, textW / bold.widthOfTextAtSize(printed, 1));
    page.drawText(printed, { x: textX, y: top - pad - codeSize, size: codeSize, font: bold });
    const small = large ? 10 : 6.5;
    const lines = [...wrap(input.companyName, (t) => regular.widthOfTextAtSize(t, small) <= textW), ...wrap(`Scan for this appliance’s ${RECORD_WORDS.lifeRecord}`, (t) => regular.widthOfTextAtSize(t, small) <= textW)];
    lines.slice(0, large ? 6 : 4).forEach((line, k) => {
      page.drawText(line, { x: textX, y: top - pad - codeSize - (k + 1) * (small + 2) - 2, size: small, font: regular, color: rgb(0.2, 0.2, 0.2) });
    });
  }
  return doc.save();
}
