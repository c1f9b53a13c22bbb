import type { VisitRow } from '../visits';

type Amendment = { reason: string; changes: Record<string, unknown> };
type Outcome = { outcome?: VisitRow['outcome']; outcomeReason?: string | null };

/**
 * A visit's fields as its amendments left them, newest last (the stored visit never changes: amendments only).
 * Covers what the report prints: findings, recommendations, results and the outcome.
 */
export function visitAsCorrected(visit: VisitRow, amendments: Amendment[]) {
  let { findings, recommendations, results, outcome, outcomeReason } = visit;
  for (const { changes } of amendments) {
    if (typeof changes.findings === 'string') findings = changes.findings;
    if (typeof changes.recommendations === 'string') recommendations = changes.recommendations;
    if (changes.results && typeof changes.results === 'object') results = changes.results as VisitRow['results'];
    const o = changes.outcome as Outcome | undefined;
    if (o?.outcome !== undefined) outcome = o.outcome;
    if (o?.outcomeReason !== undefined) outcomeReason = o.outcomeReason;
  }
  return { ...visit, findings, recommendations, results, outcome, outcomeReason, corrections: amendments.map((a) => a.reason) };
}
