import { HttpError } from '../../lib/http-error';
import type { Construction } from '../../../shared/schemas/enums';
import { completionRequirements, requirementDetails } from '../../../shared/visits/completion-requirements';
import type { VisitResults } from './visit-results';
import type { VisitRow } from './visits.repository';

/** Refuses a sign-off with one field error per missing thing, by the rule the visit editor shows live. */
export function assertCompletable(visit: VisitRow, results: VisitResults, appliance: { construction: Construction }) {
  const missing = completionRequirements({
    type: visit.type,
    checklist: visit.checklist,
    readings: visit.readings,
    readingSkips: visit.readingSkips,
    requiredReadings: visit.requiredReadings,
    flags: results.flags,
    lowWaterCutoffFailed: results.lowWaterCutoff?.passed === false,
    outcome: visit.outcome,
    outcomeReason: visit.outcomeReason,
    outcomeToldWhom: visit.outcomeToldWhom,
    appliance,
  });
  if (missing.length) {
    const what = missing.length === 1 ? 'one thing is missing' : `${missing.length} things are missing`;
    throw new HttpError(400, 'validation_failed', `Not completed yet: ${what}.`, requirementDetails(missing));
  }
}
