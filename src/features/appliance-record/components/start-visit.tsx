import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { LABELS, VISIT_TYPES, type VisitType } from '@shared/schemas/enums';
import type { NextBookingDto } from '@shared/schemas/bookings';
import { useStartVisit } from '../api/start-visit';

type Props = { applianceId: string; openDraftVisitId: string | null; booking: NextBookingDto | null };

export function StartVisit({ applianceId, openDraftVisitId, booking }: Props) {
  const navigate = useNavigate();
  const start = useStartVisit();
  const [type, setType] = useState<VisitType>('annual_maintenance');

  if (openDraftVisitId) {
    return (
      <Button className="min-h-14 w-full text-xl" onClick={() => navigate(`/visits/${openDraftVisitId}`)}>
        Continue visit
      </Button>
    );
  }
  // On the booked day the visit belongs to the booking, so completing it marks the booking done.
  const bookingId = booking?.isToday ? booking.id : undefined;
  return (
    <div className="flex flex-col gap-2">
      {start.isError && (
        <Notice kind="danger" title="Visit not started">
          {start.error.message}
        </Notice>
      )}
      <Button
        className="min-h-14 w-full text-xl"
        disabled={start.isPending}
        onClick={() => start.mutate({ applianceId, type, bookingId }, { onSuccess: (visit) => navigate(`/visits/${visit.id}`) })}
      >
        {start.isPending ? 'Starting…' : bookingId ? 'Start the booked visit' : 'Start visit'}
      </Button>
      <label className="flex items-center gap-2 text-sm font-semibold">
        Visit type
        <select
          value={type}
          onChange={(e) => setType(e.target.value as VisitType)}
          className="min-h-tap flex-1 rounded-plate border-2 border-plate-line bg-plate px-2 text-base font-normal text-iron"
        >
          {VISIT_TYPES.map((t) => (
            <option key={t} value={t}>
              {LABELS.visitType[t]}
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}
