import { StatusBadge, type Status } from '@/components/ui/status-badge';
import type { ApplianceRecordDto } from '@shared/schemas/records';

const LOOK: Record<NonNullable<ApplianceRecordDto['endOfLife']>['status'], { status: Status; word: string }> = {
  within: { status: 'ok', word: 'Within median life' },
  near: { status: 'soon', word: 'Near median life' },
  past: { status: 'due', word: 'Past median life' },
  unknown: { status: 'info', word: 'No published median' },
};

export function EndOfLife({ endOfLife, ageYears }: { endOfLife: ApplianceRecordDto['endOfLife']; ageYears: number | null }) {
  if (!endOfLife) return null;
  const look = LOOK[endOfLife.status];
  return (
    <div className="flex flex-col gap-1 rounded-plate border-2 border-plate-line bg-plate-deep p-3" title={endOfLife.source}>
      <div className="flex flex-wrap items-center gap-2">
        <span className="font-bold">Service life</span>
        <StatusBadge status={look.status}>{look.word}</StatusBadge>
      </div>
      <p className="text-sm">
        {endOfLife.medianYears == null
          ? 'No published median service life for this kind of appliance.'
          : `${ageYears == null ? 'Age unknown' : `${ageYears} years old`}; ${endOfLife.medianYears} years is the median service life (ASHRAE; half of equipment outlives it).`}
      </p>
    </div>
  );
}
