/**
 * The due engine's API. Routes (under /api, tenant-filtered):
 *
 *   GET /due-rules                     DueRuleDto[]  records:read
 *   PUT /due-rules/:id                 DueRuleDto    catalog:manage  (recomputes the company's due dates)
 *   GET /due?withinDays=&type=&applianceKind=&technicianId=&town=&after=&limit=
 *                                      Page<DueItemDto>  records:read  (due or overdue through today + withinDays; keyset on (dueOn, id))
 *   GET /due/stock?withinDays=         DueStockDto   records:read  (counts by part type and spec)
 */
import { z } from 'zod';
import * as E from './enums';
import { requiredText, storableText } from './common';
import { DUE_RULE_BASES, REPLACEMENT_POLICIES } from '../trade/due-dates';

const dueRuleFields = z.object({
  inspectionIntervalMonths: z
    .number('Inspection interval must be a number of months.')
    .int('Use whole months.')
    .min(1, 'At least 1 month.')
    .max(120, 'At most 120 months.')
    .nullable(),
  replacementAgeYears: z.number('Replacement age must be a number of years.').int('Use whole years.').min(1, 'At least 1 year.').max(100, 'At most 100 years.').nullable(),
  replacementPolicy: z.enum(REPLACEMENT_POLICIES, 'Choose when the part is replaced.'),
  basis: z.enum(DUE_RULE_BASES, 'Say what the rule is based on.'),
  source: requiredText('Source', 500),
});
const policyAndAge = dueRuleFields.pick({ replacementPolicy: true, replacementAgeYears: true });

export const dueRuleInput = dueRuleFields.superRefine(
  (rule, ctx) => {
    if (rule.replacementPolicy === 'fixed_age' && rule.replacementAgeYears === null) {
      ctx.addIssue({ code: 'custom', path: ['replacementAgeYears'], message: 'Give the replacement age for a fixed-age rule.' });
    }
    if (rule.replacementPolicy !== 'fixed_age' && rule.replacementAgeYears !== null) {
      ctx.addIssue({ code: 'custom', path: ['replacementAgeYears'], message: 'Only a fixed-age rule has a replacement age.' });
    }
  },
  // Checked even when another field is wrong, so every message shows at once.
  { when: (payload) => policyAndAge.safeParse(payload.value).success },
);
export type DueRuleInput = z.input<typeof dueRuleInput>;

export type DueRuleDto = {
  id: string;
  componentType: string;
  typeLabel: string;
  /** null: the rule covers every appliance kind; a kind-specific rule wins over it. */
  applianceKind: E.ApplianceKind | null;
  inspectionIntervalMonths: number | null;
  replacementAgeYears: number | null;
  /** An adopted learned median: a planning age (inspect and plan, listed in the stock forecast), never a replacement date. */
  planningAgeYears: number | null;
  replacementPolicy: (typeof REPLACEMENT_POLICIES)[number];
  basis: (typeof DUE_RULE_BASES)[number];
  source: string;
  updatedAt: string;
};

const withinDays = z.coerce.number('Give a number of days.').int('Use whole days.').min(0, 'At least 0 days.').max(3660, 'At most 3660 days.').default(90);

export const dueQuery = z.object({
  withinDays,
  type: storableText().trim().max(60).optional(),
  applianceKind: z.enum(E.APPLIANCE_KINDS).optional(),
  technicianId: z.uuid('Not a valid technician.').optional(),
  town: storableText().trim().max(120).optional(),
  after: storableText().max(100).optional(),
  limit: z.coerce.number().int().min(1).max(100).default(100),
});
export type DueQuery = z.input<typeof dueQuery>;

export const dueStockQuery = z.object({ withinDays });

/** 'later': inside the list's window but beyond the company's "due soon" window (companies.due_soon_days). */
export type DueItemStatus = 'overdue' | 'due_soon' | 'later' | 'replace_now';

export type DueItemDto = {
  componentId: string;
  typeCode: string;
  typeLabel: string;
  specKey: string;
  description: string | null;
  dueOn: string;
  dueKind: 'inspection' | 'replacement';
  status: DueItemStatus;
  reason: string;
  appliance: { id: string; kind: E.ApplianceKind; fuel: E.Fuel; manufacturer: string | null; model: string | null; location: string | null };
  site: { id: string; street: string; town: string; assignedTechnicianId: string | null; assignedTechnicianName: string | null };
  customer: { id: string; name: string };
};

export type DueStockRow = { typeCode: string; typeLabel: string; specKey: string; count: number };

/** Parts to have on hand for what falls due through `through`; replacements and inspections are kept apart. */
export type DueStockDto = {
  withinDays: number;
  through: string;
  replacements: DueStockRow[];
  inspections: DueStockRow[];
  /** Working parts that reach their ASHRAE median life by `through`: to plan and order for, not due by age. */
  pastMedianLife: DueStockRow[];
  pastMedianLifeSource: string;
};
