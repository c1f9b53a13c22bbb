import type { VisitOutcome } from '../schemas/enums';

/** The one name of each visit outcome: the visit screen, the record, the share page, the e-mails and the PDFs use it. */
export const OUTCOME_LABELS: Record<VisitOutcome, string> = {
  left_operating: 'Left operating',
  shut_down_unsafe: 'Shut down as unsafe',
};

/**
 * The outcome as a household reads it: the label, and for a shut-down the reason after it
 * ("Shut down as unsafe: cracked heat exchanger"). Null while the visit has no outcome.
 */
export function outcomeWords(outcome: VisitOutcome | null | undefined, reason?: string | null, missingReason = 'see the technician’s note'): string | null {
  if (!outcome) return null;
  if (outcome === 'shut_down_unsafe') return `${OUTCOME_LABELS.shut_down_unsafe}: ${reason?.trim() || missingReason}`;
  return OUTCOME_LABELS[outcome];
}

/** The outcome inside a sentence ("Annual maintenance: left operating."). */
export const outcomeInSentence = (outcome: VisitOutcome) => OUTCOME_LABELS[outcome].toLowerCase();
