/** Printing formats, described by size only. Points: 72 per inch. */
export const PT_PER_IN = 72;

export type TagFormat = {
  id: 'sheet_1x2_625' | 'single_large';
  label: string;
  page: { widthIn: number; heightIn: number };
  label_: { widthIn: number; heightIn: number };
  columns: number;
  rows: number;
  marginLeftIn: number;
  marginTopIn: number;
  pitchXIn: number;
  pitchYIn: number;
};

export const TAG_FORMATS: Record<TagFormat['id'], TagFormat> = {
  // 30 labels of 1 × 2⅝ in on US Letter: 3 columns × 10 rows, ⅛ in between columns.
  sheet_1x2_625: {
    id: 'sheet_1x2_625',
    label: 'Sheet of 1 × 2⅝ in labels (3 × 10 on US Letter)',
    page: { widthIn: 8.5, heightIn: 11 },
    label_: { widthIn: 2.625, heightIn: 1 },
    columns: 3,
    rows: 10,
    marginLeftIn: 0.1875,
    marginTopIn: 0.5,
    pitchXIn: 2.75,
    pitchYIn: 1,
  },
  // One large tag per page, for a label printer or a cut card: 4 × 2½ in.
  single_large: {
    id: 'single_large',
    label: 'Single large tag, 4 × 2½ in',
    page: { widthIn: 4, heightIn: 2.5 },
    label_: { widthIn: 4, heightIn: 2.5 },
    columns: 1,
    rows: 1,
    marginLeftIn: 0,
    marginTopIn: 0,
    pitchXIn: 4,
    pitchYIn: 2.5,
  },
};

export const tagsPerPage = (f: TagFormat) => f.columns * f.rows;
