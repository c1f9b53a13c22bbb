import Papa from 'papaparse';
import type { DueItemDto } from '../../../shared/schemas/due';

const STATUS_WORDS = { replace_now: 'replace now', overdue: 'overdue', due_soon: 'due soon', later: 'later' } as const;

/** The due list as CSV for a spreadsheet; papaparse quotes commas, quotes and line breaks in names and notes. */
export function dueItemsToCsv(items: DueItemDto[]): string {
  return Papa.unparse(
    {
      fields: ['Due on', 'Status', 'What', 'Part', 'Specification', 'Customer', 'Street', 'Town', 'Appliance', 'Location', 'Technician', 'Why'],
      data: items.map((i) => [
        i.dueOn,
        STATUS_WORDS[i.status],
        i.dueKind === 'replacement' ? 'replace' : 'inspect',
        i.typeLabel,
        i.specKey,
        i.customer.name,
        i.site.street,
        i.site.town,
        [i.appliance.manufacturer, i.appliance.model].filter(Boolean).join(' ') || i.appliance.kind,
        i.appliance.location ?? '',
        i.site.assignedTechnicianName ?? '',
        i.reason,
      ]),
    },
    // Spreadsheets open a leading = + - @ as a formula; escapeFormulae neutralises that (CSV injection).
    { escapeFormulae: true, newline: '\r\n' },
  );
}
