import { formatCalendarDate } from '../format/dates';
import { todayInTimeZone } from '../dates';
import type { TransferProvenanceDto } from '../schemas/record-transfers';

/** "Recorded by another company (Sender Heating); imported Feb 3, 2027": the day read on the company's clocks. */
export function provenanceWords(p: TransferProvenanceDto, timeZone: string): string {
  return `Recorded by another company (${p.senderName}); imported ${formatCalendarDate(todayInTimeZone(timeZone, new Date(p.receivedAt)))}`;
}
