import Papa from 'papaparse';
import { HttpError } from '../../lib/http-error';
import { MAX_IMPORT_ROWS } from '../../../shared/schemas/imports';
import { parseImportDate } from '../../../shared/imports/parse-import-date';

export type ParsedImportFile = { encoding: 'utf-8' | 'windows-1252'; headers: string[]; rows: string[][] };

const refuse = (message: string) => new HttpError(400, 'import_file_rejected', message, { file: [message] });

/**
 * Bytes → text. UTF-8 (with or without a byte-order mark) when the bytes are valid UTF-8, else Windows-1252, which
 * is what spreadsheets on Windows save as "CSV" and which maps every byte (so nothing is lost in the fallback).
 */
export function decodeImportBytes(bytes: Buffer): { text: string; encoding: ParsedImportFile['encoding'] } {
  if (bytes.length === 0) throw refuse('The file is empty.');
  const sample = bytes.subarray(0, 64 * 1024);
  let control = 0;
  for (const b of sample) {
    if (b === 0) throw refuse('This is not a text file (it holds binary data). Save the sheet as CSV and upload that.');
    if (b < 32 && b !== 9 && b !== 10 && b !== 13) control++;
  }
  if (control > sample.length / 100) throw refuse('This is not a text file (it holds binary data). Save the sheet as CSV and upload that.');
  try {
    const text = new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
    return { text, encoding: 'utf-8' };
  } catch {
    return { text: new TextDecoder('windows-1252').decode(bytes), encoding: 'windows-1252' };
  }
}

/** Text → header and rows. Quoted commas, quotes and line breaks inside a field are one field (RFC 4180). */
export function parseImportText(text: string, encoding: ParsedImportFile['encoding']): ParsedImportFile {
  const result = Papa.parse<string[]>(text, { skipEmptyLines: 'greedy' });
  const [headerRow, ...rows] = result.data;
  if (!headerRow || headerRow.every((h) => !h.trim())) throw refuse('The file has no rows.');
  const headers = headerRow.map((h) => h.trim());
  const blank = headers.findIndex((h) => !h);
  if (blank >= 0) throw refuse(`Column ${blank + 1} of the first row has no name. The first row must name every column.`);
  const looksLikeData = headers.find((h) => parseImportDate(h) !== null || /^[\d\s.,$()-]+$/.test(h) || /@/.test(h));
  if (looksLikeData) throw refuse(`The first row reads like data ('${looksLikeData}'), not column names. Add a header row naming the columns.`);
  const seen = new Set<string>();
  for (const h of headers) {
    const key = h.toLowerCase();
    if (seen.has(key)) throw refuse(`Two columns are both called '${h}'. Give each column its own name.`);
    seen.add(key);
  }
  if (!rows.length) throw refuse('The file has a header row but no data rows.');
  if (rows.length > MAX_IMPORT_ROWS) throw refuse(`The file has ${rows.length.toLocaleString('en-US')} rows; at most ${MAX_IMPORT_ROWS.toLocaleString('en-US')} at a time. Split it.`);
  const unterminated = result.errors.find((e) => e.code === 'MissingQuotes');
  if (unterminated) throw refuse(`Row ${(unterminated.row ?? 0) + 1} opens a quote that is never closed.`);
  return { encoding, headers, rows };
}

export const readImportFile = (bytes: Buffer) => {
  const { text, encoding } = decodeImportBytes(bytes);
  return parseImportText(text, encoding);
};
