/**
 * The names of things people read on more than one screen, in one place so they cannot drift apart.
 * One word each: the appliance's whole history is its life record (never "service record"); the office page the
 * technicians pick parts and checklists from is "Parts & checklists", and its part list is "Part types".
 */
export const RECORD_WORDS = {
  /** The whole history of one appliance. */
  lifeRecord: 'life record',
  /** The office page (nav and heading). */
  catalogPage: 'Parts & checklists',
  /** Its sections. */
  partTypes: 'Part types',
  checklistTemplates: 'Checklist templates',
  dueRules: 'Due rules',
} as const;

/** The folded and open blocks of the life record, as the office and technician see it. */
export const RECORD_SECTIONS = {
  whatItIs: 'What it is',
  whatIsDue: 'What is due',
  parts: 'Parts',
  history: 'History',
  makeupWater: 'Makeup water',
  combustionTrend: 'Combustion over the years',
  share: 'Share with the homeowner',
  transfer: 'Transfer to another company',
} as const;

/** "The appliance’s life record" and its capitalised form, for sentences. */
export const lifeRecordOf = (whose: string) => `${whose} ${RECORD_WORDS.lifeRecord}`;
