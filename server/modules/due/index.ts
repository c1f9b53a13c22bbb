// The public face of the due module: what other modules may import. Its repository stays private (see DEVELOPERS.md, Module boundaries).
export { recomputeDueStatement } from './due-recompute.sql';
export { seedCompanyDueRules } from './due-rules.seed';
export { describeStoredDue } from './due-status';
export type { DueRuleChange, DueRuleRow } from './due.repository';
export { recomputeDueForAppliance, recomputeDueForCompany } from './due.repository';
export { dueService } from './due.service';

import { dueRepository } from './due.repository';

export const findDueRule = (...args: Parameters<typeof dueRepository.findRule>) => dueRepository.findRule(...args);
export const updateDueRule = (...args: Parameters<typeof dueRepository.updateRule>) => dueRepository.updateRule(...args);
