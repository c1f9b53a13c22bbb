import type { AppContext } from '../../context';
import { badRequest, notFound } from '../../lib/http-error';
import { kaplanMeierFromCounts, medianConfidence95, medianSurvival, type SurvivalStep, type TimeCount } from '../../../shared/stats/kaplan-meier';
import { MIN_EVENTS_TO_ADOPT, type ServiceLifeDto, type ServiceLifePoint } from '../../../shared/schemas/service-life';
import type { DueRuleDto } from '../../../shared/schemas/due';
import { recordAudit } from '../../core/audit-log';
import { companyToday } from '../../core/company-today';
import { findDueRule, updateDueRule, recomputeDueForCompany, type DueRuleChange, type DueRuleRow } from '../due';
import { dueService } from '../due';
import { typeLabelFor } from '../../core/type-label';
import { catalogLabels } from '../catalog';
import { serviceLifeCounts, type AgeCountRow } from './service-life.repository';

type Actor = { userId: string; companyId: string };

const DAYS_PER_YEAR = 365.25;
const MAX_CURVE_POINTS = 120;
const round = (x: number, digits: number) => Math.round(x * 10 ** digits) / 10 ** digits;
const toYears = (days: number | null) => (days === null ? null : round(days / DAYS_PER_YEAR, 2));

function thin(steps: SurvivalStep[]): ServiceLifePoint[] {
  const stride = Math.max(1, Math.ceil(steps.length / MAX_CURVE_POINTS));
  return steps
    .filter((_, i) => i % stride === 0 || i === steps.length - 1)
    .map((s) => ({ years: toYears(s.time)!, survival: round(s.survival, 4), lower95: round(s.lower95, 4), upper95: round(s.upper95, 4), atRisk: s.atRisk, events: s.events }));
}

/** The estimate for one part type from its rows of counts by age in days. */
export function estimateFor(componentType: string, typeLabel: string, rows: AgeCountRow[]): ServiceLifeDto {
  const byDay = new Map<number, TimeCount>();
  let first: string | null = null;
  let last: string | null = null;
  for (const r of rows) {
    const row = byDay.get(r.days) ?? { time: r.days, events: 0, censored: 0 };
    if (r.event) row.events += r.n;
    else row.censored += r.n;
    byDay.set(r.days, row);
    if (r.first_on && (!first || r.first_on < first)) first = r.first_on;
    if (r.last_on && (!last || r.last_on > last)) last = r.last_on;
  }
  const counts = [...byDay.values()];
  const steps = kaplanMeierFromCounts(counts);
  const events = counts.reduce((n, c) => n + c.events, 0);
  const ci = medianConfidence95(steps);
  const medianYears = toYears(medianSurvival(steps));
  return {
    componentType,
    typeLabel,
    atRisk: counts.reduce((n, c) => n + c.events + c.censored, 0),
    events,
    medianYears,
    median95: { lowerYears: toYears(ci.lower), upperYears: toYears(ci.upper) },
    firstEventYear: first ? Number(first.slice(0, 4)) : null,
    lastEventYear: last ? Number(last.slice(0, 4)) : null,
    curve: thin(steps),
    canAdopt: events >= MIN_EVENTS_TO_ADOPT && medianYears !== null,
  };
}

/** "Learned from 412 swaps, 2009–2026: …": the rule's source once adopted. */
export function learnedSource(e: ServiceLifeDto): string {
  const years = e.firstEventYear === e.lastEventYear ? `${e.firstEventYear}` : `${e.firstEventYear}–${e.lastEventYear}`;
  const ci = `95 % CI ${e.median95.lowerYears ?? '?'}–${e.median95.upperYears ?? 'not reached'} years`;
  return `Learned from ${e.events} swaps, ${years}: Kaplan–Meier median ${e.medianYears} years (${ci}; Greenwood, log-log), ${e.atRisk} parts at risk.`;
}

/** A replacement interval read in a publication (or the manufacturer's instructions), not a median of ages. */
const onPublishedInterval = (rule: DueRuleRow) => rule.replacementPolicy === 'fixed_age' && (rule.basis === 'published' || rule.basis === 'manufacturer');

/** What adopting a learned median of `years` writes to the rule (see adopt). */
export function adoptedChange(rule: DueRuleRow, years: number, source: string): DueRuleChange {
  if (onPublishedInterval(rule)) {
    return {
      inspectionIntervalMonths: rule.inspectionIntervalMonths,
      replacementPolicy: 'fixed_age',
      replacementAgeYears: years,
      planningAgeYears: null,
      basis: 'learned',
      source: `${source} Replaces the ${rule.replacementAgeYears}-year replacement interval of: ${rule.source}`.slice(0, 500),
    };
  }
  return {
    inspectionIntervalMonths: rule.inspectionIntervalMonths ?? 12,
    // A part replaced at every service stays so; anything else is replaced on condition, as the ASHRAE defaults are.
    replacementPolicy: rule.replacementPolicy === 'annual' ? 'annual' : 'on_condition',
    replacementAgeYears: null,
    planningAgeYears: years,
    basis: 'learned',
    source: `${source} Adopted as a planning age (inspect and plan), not a replacement date: medians describe populations, not one unit.`,
  };
}

export function serviceLifeService(ctx: AppContext) {
  async function estimates(companyId: string, type?: string): Promise<ServiceLifeDto[]> {
    const today = await companyToday(ctx.db, companyId);
    const [rows, labels] = await Promise.all([serviceLifeCounts(ctx.db, companyId, today, type), catalogLabels(ctx.db, companyId)]);
    const byType = new Map<string, AgeCountRow[]>();
    for (const r of rows) byType.set(r.type_code, [...(byType.get(r.type_code) ?? []), r]);
    return [...byType.entries()]
      .map(([code, typeRows]) => estimateFor(code, typeLabelFor(code, labels.get(code)?.label), typeRows))
      .sort((a, b) => a.typeLabel.localeCompare(b.typeLabel));
  }

  return {
    estimates,

    /**
     * Adopts the learned median (whole years) and recomputes the due dates. Age is not a fault: like the ASHRAE
     * medians (PLANNING_MEDIAN_YEARS), the learned median describes the population, so it becomes the rule's planning
     * age (the stock forecast lists parts past it; the part is inspected and replaced on condition), never a
     * replacement date. Only a rule already on a published or manufacturer's replacement interval keeps replacing by
     * age, with the learned median as that age.
     */
    async adopt(actor: Actor, ruleId: string): Promise<DueRuleDto> {
      const found = await findDueRule(ctx.db, actor.companyId, ruleId);
      if (!found) throw notFound('Due rule');
      const [estimate] = await estimates(actor.companyId, found.rule.componentType);
      if (!estimate || estimate.events < MIN_EVENTS_TO_ADOPT) {
        throw badRequest(`A learned service life needs at least ${MIN_EVENTS_TO_ADOPT} parts that wore out or failed.`, {
          _: [`${estimate?.events ?? 0} of ${MIN_EVENTS_TO_ADOPT} so far.`],
        });
      }
      if (estimate.medianYears === null) throw badRequest('The survival curve has not reached one half yet, so there is no median to adopt.', { _: ['No median yet.'] });
      const years = Math.max(1, Math.round(estimate.medianYears));
      const change = adoptedChange(found.rule, years, learnedSource(estimate));
      await ctx.db.transaction(async (tx) => {
        const before = await findDueRule(tx, actor.companyId, ruleId);
        if (!before) throw notFound('Due rule');
        await updateDueRule(tx, actor.companyId, ruleId, change, actor.userId);
        await recomputeDueForCompany(tx, actor.companyId);
        const { inspectionIntervalMonths, replacementAgeYears, planningAgeYears, replacementPolicy, basis, source } = before.rule;
        await recordAudit(tx, {
          companyId: actor.companyId,
          actorId: actor.userId,
          action: 'adopt_learned_life',
          entity: 'due_rule',
          entityId: ruleId,
          changes: { before: { inspectionIntervalMonths, replacementAgeYears, planningAgeYears, replacementPolicy, basis, source }, after: change, events: estimate.events, atRisk: estimate.atRisk },
        });
      });
      return (await dueService(ctx).listRules(actor.companyId)).find((r) => r.id === ruleId)!;
    },
  };
}
