import { MIN_EVENTS_TO_ADOPT, type ServiceLifeDto } from '@shared/schemas/service-life';
import type { DueRuleDto } from '@shared/schemas/due';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { describeFailure } from '@/lib/form-errors';
import { useAdoptLearnedLife } from '../api/adopt-learned-life';

const W = 240;
const H = 90;

/** A small step curve of the share of parts still in service by age, with its 95 % band. */
export function SurvivalCurve({ estimate }: { estimate: ServiceLifeDto }) {
  const maxYears = Math.max(1, ...estimate.curve.map((p) => p.years));
  const x = (years: number) => (years / maxYears) * (W - 30) + 28;
  const y = (s: number) => (1 - s) * (H - 20) + 4;
  const path = (pick: (p: ServiceLifeDto['curve'][number]) => number) => {
    let d = `M${x(0)},${y(1)}`;
    for (const p of estimate.curve) d += ` H${x(p.years).toFixed(1)} V${y(pick(p)).toFixed(1)}`;
    return d;
  };
  const median = estimate.medianYears;
  return (
    <svg viewBox={`0 0 ${W} ${H}`} width={W} height={H} role="img" aria-label={`Share of ${estimate.typeLabel} parts still in service by age`} className="text-iron">
      <line x1={28} y1={y(0)} x2={W - 2} y2={y(0)} stroke="currentColor" strokeOpacity={0.4} />
      <line x1={28} y1={y(0)} x2={28} y2={y(1)} stroke="currentColor" strokeOpacity={0.4} />
      <line x1={28} y1={y(0.5)} x2={W - 2} y2={y(0.5)} stroke="currentColor" strokeOpacity={0.3} strokeDasharray="3 3" />
      <text x={24} y={y(1) + 4} fontSize={9} textAnchor="end" fill="currentColor">100%</text>
      <text x={24} y={y(0.5) + 3} fontSize={9} textAnchor="end" fill="currentColor">50%</text>
      <text x={24} y={y(0) + 3} fontSize={9} textAnchor="end" fill="currentColor">0</text>
      <text x={W - 2} y={H - 2} fontSize={9} textAnchor="end" fill="currentColor">{`${Math.round(maxYears)} years`}</text>
      <path d={path((p) => p.upper95)} fill="none" stroke="currentColor" strokeOpacity={0.35} strokeDasharray="2 2" />
      <path d={path((p) => p.lower95)} fill="none" stroke="currentColor" strokeOpacity={0.35} strokeDasharray="2 2" />
      <path d={path((p) => p.survival)} fill="none" stroke="currentColor" strokeWidth={2} />
      {median !== null && <line x1={x(median)} y1={y(0)} x2={x(median)} y2={y(0.5)} stroke="currentColor" strokeOpacity={0.6} />}
    </svg>
  );
}

/** Mirrors the server: only a rule on a published or manufacturer's replacement interval keeps replacing by age. */
const adoptsAsReplacementAge = (rule: DueRuleDto) => rule.replacementPolicy === 'fixed_age' && (rule.basis === 'published' || rule.basis === 'manufacturer');

const yearsText = (y: number | null) => (y === null ? 'not reached' : `${y.toFixed(1)}`);

export function LearnedLife({ rule, estimate }: { rule: DueRuleDto; estimate: ServiceLifeDto }) {
  const adopt = useAdoptLearnedLife();
  const years = estimate.firstEventYear === estimate.lastEventYear ? `${estimate.firstEventYear ?? ''}` : `${estimate.firstEventYear}–${estimate.lastEventYear}`;
  const adopted = rule.basis === 'learned';
  return (
    <section aria-label={`Service life learned for ${estimate.typeLabel}`} className="mt-2 flex flex-wrap items-start gap-3 rounded-plate border border-plate-line bg-surface p-2">
      <SurvivalCurve estimate={estimate} />
      <div className="min-w-48 flex-1 text-sm">
        <p className="font-semibold">Learned from our own part swaps</p>
        <p>
          Median service life: <strong>{estimate.medianYears === null ? 'not reached yet' : `${yearsText(estimate.medianYears)} years`}</strong>
          {estimate.medianYears !== null && (
            <span> (95 % interval {yearsText(estimate.median95.lowerYears)} to {yearsText(estimate.median95.upperYears)} years)</span>
          )}
        </p>
        <p className="text-iron-muted">
          {estimate.events} worn out or failed{estimate.events ? `, ${years}` : ''} · {estimate.atRisk} parts on record. Parts still in service, upgraded
          or removed with their boiler count only for as long as they were seen (Kaplan–Meier).
        </p>
        <p className="text-iron-muted">
          Rule today: {rule.replacementAgeYears ? `replace at ${rule.replacementAgeYears} years` : 'no fixed replacement age'}
          {rule.planningAgeYears ? `, planning age ${rule.planningAgeYears} years` : ''} ({rule.source})
        </p>
        {adopt.isError && (
          <Notice kind="danger" title="Not adopted">
            {describeFailure(adopt.error).message}
          </Notice>
        )}
        {!adopted && estimate.canAdopt && estimate.medianYears !== null && (
          <Button className="mt-2" variant="secondary" disabled={adopt.isPending} onClick={() => adopt.mutate(rule.id)} aria-label={`Adopt the learned service life for ${estimate.typeLabel}`}>
            Adopt {Math.max(1, Math.round(estimate.medianYears))} years as the {adoptsAsReplacementAge(rule) ? 'replacement age' : 'planning age'}
          </Button>
        )}
        {!adopted && estimate.canAdopt && !adoptsAsReplacementAge(rule) && (
          <p className="text-iron-muted">
            A median describes all such parts, not this one: parts past it are listed to inspect and plan for, and are replaced on condition.
          </p>
        )}
        {!estimate.canAdopt && (
          <p className="text-iron-muted">
            Can be adopted once {MIN_EVENTS_TO_ADOPT} parts have worn out or failed ({estimate.events} so far){estimate.events >= MIN_EVENTS_TO_ADOPT ? ' and the curve reaches one half' : ''}.
          </p>
        )}
      </div>
    </section>
  );
}
