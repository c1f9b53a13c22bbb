import { describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { pdfPageText as pageText } from '../../support/pdf-text';
import { generateTagCode, formatTagCode } from '../../../shared/tags/tag-code';
import { renderTagSheetPdf } from '../../../server/modules/tags/tag-sheet-pdf';

describe('tag sheet PDF', () => {
  it('puts 30 tags on each US Letter sheet and prints every code', async () => {
    const codes = Array.from({ length: 31 }, () => generateTagCode());
    const pdf = await PDFDocument.load(await renderTagSheetPdf({ codes, baseUrl: 'https://lifeplate.example.test', companyName: 'Test Heating', format: 'sheet_1x2_625' }));
    expect(pdf.getPageCount()).toBe(2);
    const [w, h] = [pdf.getPage(0).getWidth(), pdf.getPage(0).getHeight()];
    expect([w, h]).toEqual([612, 792]); // 8.5 × 11 in at 72 pt/in
    const text = pdf.getPages().map(pageText).join('');
    for (const code of codes) expect(text).toContain(formatTagCode(code));
    expect(pageText(pdf.getPage(1)).match(/-/g)).toHaveLength(1);
  });

  it('prints one large tag per page', async () => {
    const codes = [generateTagCode(), generateTagCode(), generateTagCode()];
    const pdf = await PDFDocument.load(await renderTagSheetPdf({ codes, baseUrl: 'https://x.test', companyName: 'Test Heating', format: 'single_large' }));
    expect(pdf.getPageCount()).toBe(3);
    expect([pdf.getPage(0).getWidth(), pdf.getPage(0).getHeight()]).toEqual([288, 180]);
    expect(pageText(pdf.getPage(2))).toContain(formatTagCode(codes[2]));
  });
});
