import type { RatingComparison } from './gas-input';
import type { TradeFlag } from './trade-flag';
import { requireNumber, requireOneOf } from './trade-input-error';

/** The flag a clocked gas input raises against the nameplate: over-firing always, under-firing past the company's tolerance. */
export function gasInputRatingFlag(rating: RatingComparison, ratedBtuh: number, tolerancePct: number | null): TradeFlag | null {
  requireOneOf('rating.status', rating.status, ['over_fired', 'under_fired', 'within_rating'] as const);
  requireNumber('rating.deviationPct', rating.deviationPct, { min: -100 });
  requireNumber('rating.allowedBtuPerHour', rating.allowedBtuPerHour, { minExclusive: 0 });
  requireNumber('ratedBtuh', ratedBtuh, { minExclusive: 0 });
  if (tolerancePct !== null) requireNumber('underFiringTolerancePct', tolerancePct, { min: 0, max: 100 });
  if (rating.status === 'over_fired') {
    const against =
      rating.altitudeDeratePct > 0
        ? `the ${Math.round(rating.allowedBtuPerHour).toLocaleString('en-US')} Btu/h allowed at this altitude (the ${ratedBtuh.toLocaleString('en-US')} Btu/h nameplate derated ${rating.altitudeDeratePct.toFixed(1)} %)`
        : `the nameplate rating of ${ratedBtuh.toLocaleString('en-US')} Btu/h`;
    return {
      code: 'gas_input_over_fired',
      severity: 'warning',
      message: `Clocked input is ${rating.deviationPct.toFixed(1)} % above ${against}, beyond the ${rating.overFiringTolerancePct} % clocking tolerance: over-firing is prohibited. Adjust to the manufacturer's instructions.`,
      value: Math.round(rating.allowedBtuPerHour * (1 + rating.deviationPct / 100)),
      threshold: Math.round(rating.allowedBtuPerHour),
      unit: 'Btu/h',
      source: rating.source,
    };
  }
  if (rating.status === 'under_fired' && tolerancePct !== null) {
    return {
      code: 'gas_input_under_fired',
      severity: 'info',
      message: `Clocked input is ${Math.abs(rating.deviationPct).toFixed(1)} % below the nameplate rating, more than the company's ${tolerancePct} % tolerance.`,
      value: Math.round(rating.allowedBtuPerHour * (1 + rating.deviationPct / 100)),
      threshold: Math.round(rating.allowedBtuPerHour * (1 - tolerancePct / 100)),
      unit: 'Btu/h',
      source: 'company policy',
    };
  }
  return null;
}
