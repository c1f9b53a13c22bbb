import { requireReading } from './reading-ranges';

/**
 * The least draft a natural-draft (Category I) vent must pull at steady state, by outdoor temperature: a warm day
 * drives less stack effect, so the required suction is looser.
 *
 * from memory: BPI Technical Standards for the Building Analyst Professional, table "Minimum acceptable draft test
 * results" (below 10 °F: −2.5 Pa; 10–90 °F: T/40 − 2.75 Pa; above 90 °F: −0.5 Pa). The quoted BPI line that the
 * draft test needs at least −2.5 to −5 Pa (secondary copy) agrees with the table's cold end.
 */
export const BPI_DRAFT_TABLE_SOURCE =
  'from memory: BPI Technical Standards for the Building Analyst Professional, minimum acceptable draft by outdoor temperature';

export const BPI_DRAFT_TABLE = { coldBelowF: 10, warmAboveF: 90, coldMinimumPa: -2.5, warmMinimumPa: -0.5 } as const;

/** Minimum draft, Pa (negative is suction; the measured draft must be this or more negative). */
export function bpiMinimumDraftPa(outdoorTempF: number): number {
  const t = requireReading('outdoorTempF', outdoorTempF);
  if (t < BPI_DRAFT_TABLE.coldBelowF) return BPI_DRAFT_TABLE.coldMinimumPa;
  if (t > BPI_DRAFT_TABLE.warmAboveF) return BPI_DRAFT_TABLE.warmMinimumPa;
  return t / 40 - 2.75;
}
