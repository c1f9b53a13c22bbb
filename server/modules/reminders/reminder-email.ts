import type { ApplianceKind, Fuel } from '../../../shared/schemas/enums';
import { LABELS } from '../../../shared/schemas/enums';
import { formatCalendarDate } from '../../../shared/format/dates';
import type { ReminderKind } from '../../../shared/schemas/reminders';

export type ReminderLine = {
  kind: ReminderKind;
  dueOn: string;
  partLabel: string | null;
  dueKind: 'inspection' | 'replacement' | null;
  /** The part failed on condition at a visit; otherwise a replacement is due only by its set replacement interval. */
  failedOnCondition?: boolean;
  appliance: { kind: ApplianceKind; fuel: Fuel; street: string; town: string };
};

export type ReminderEmailInput = {
  company: { name: string; phone: string };
  customerName: string;
  today: string;
  lines: ReminderLine[];
  unsubscribeUrl: string;
};

export const SAFETY_LINE =
  'For your safety: keep carbon monoxide (CO) alarms working near where people sleep. If you smell gas, leave the building at once ' +
  'and call your gas supplier or emergency services from outside. Work on gas and oil appliances is for licensed professionals, ' +
  "following the manufacturer's instructions and local codes: please do not attempt it yourself.";

const longDate = (iso: string) => formatCalendarDate(iso, { long: true });

function applianceWords(a: ReminderLine['appliance']): string {
  return `${LABELS.applianceKind[a.kind]} (${LABELS.fuel[a.fuel].toLowerCase()}) at ${a.street}, ${a.town}`;
}

/** One sentence per reminder, in plain words: what, where, and when it was or will be due. */
export function describeLine(line: ReminderLine, today: string): string {
  const past = line.dueOn <= today;
  const when = `${past ? 'was due on' : 'is due on'} ${longDate(line.dueOn)}`;
  if (line.kind === 'annual_service') return `${applianceWords(line.appliance)}: its yearly service ${when}.`;
  const part = line.partLabel ?? 'part';
  // Age is not a fault: say whether the part was found failing, or is only on its set replacement interval.
  if (line.dueKind === 'replacement' && line.failedOnCondition) {
    return `${applianceWords(line.appliance)}: the ${part} was found worn or failing at the last visit and needs replacing, which ${when}.`;
  }
  if (line.dueKind === 'replacement') {
    return `${applianceWords(line.appliance)}: the ${part} is due for replacement on its set replacement interval (it has not been found faulty), which ${when}.`;
  }
  return `${applianceWords(line.appliance)}: the ${part} needs a check, which ${when}.`;
}

export function reminderSubject(input: Pick<ReminderEmailInput, 'company' | 'lines'>): string {
  const annual = input.lines.some((l) => l.kind === 'annual_service');
  const parts = input.lines.some((l) => l.kind === 'part_due');
  const what = annual && parts ? 'Service and parts due' : annual ? 'Yearly service due' : 'Part due';
  return `${what} for your heating equipment: ${input.company.name}`;
}

export function reminderText(input: ReminderEmailInput): string {
  return [
    `Hello ${input.customerName},`,
    '',
    `This is a reminder from ${input.company.name} about your heating equipment.`,
    '',
    ...input.lines.map((l) => `- ${describeLine(l, input.today)}`),
    '',
    `To book a visit, call ${input.company.name} at ${input.company.phone}.`,
    '',
    SAFETY_LINE,
    '',
    `You get these e-mails because ${input.company.name} services your heating equipment.`,
    `To stop reminder e-mails, open: ${input.unsubscribeUrl}`,
    '',
  ].join('\n');
}

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function reminderHtml(input: ReminderEmailInput): string {
  const e = escapeHtml;
  return [
    '<!doctype html><html lang="en"><head><meta charset="utf-8"><title>' + e(reminderSubject(input)) + '</title></head>',
    '<body style="font-family: sans-serif; line-height: 1.5; color: #1f2328;">',
    `<p>Hello ${e(input.customerName)},</p>`,
    `<p>This is a reminder from <strong>${e(input.company.name)}</strong> about your heating equipment.</p>`,
    '<ul>',
    ...input.lines.map((l) => `<li>${e(describeLine(l, input.today))}</li>`),
    '</ul>',
    `<p>To book a visit, call ${e(input.company.name)} at <a href="tel:${e(input.company.phone.replace(/[^\d+]/g, ''))}">${e(input.company.phone)}</a>.</p>`,
    `<p><strong>${e(SAFETY_LINE)}</strong></p>`,
    `<p style="font-size: 0.9em;">You get these e-mails because ${e(input.company.name)} services your heating equipment. `,
    `<a href="${e(input.unsubscribeUrl)}">Stop reminder e-mails</a>.</p>`,
    '</body></html>',
  ].join('\n');
}
