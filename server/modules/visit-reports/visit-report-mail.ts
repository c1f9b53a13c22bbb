import type { VisitReport } from './visit-report-content';
import { RECORD_WORDS } from '../../../shared/glossary/words';

const longDate = (iso: string) =>
  new Intl.DateTimeFormat('en-US', { timeZone: 'UTC', year: 'numeric', month: 'long', day: 'numeric' }).format(new Date(`${iso}T00:00:00Z`));

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

type Links = { shareUrl: string; unsubscribeUrl: string };

export function visitReportSubject(r: VisitReport): string {
  return r.unsafe
    ? `Important: your ${r.appliance.title.toLowerCase()} was shut down as unsafe: ${r.company.name}`
    : `Your visit report, ${longDate(r.visit.visitedOn)}: ${r.company.name}`;
}

function lines(r: VisitReport, links: Links): string[] {
  return [
    ...(r.unsafe ? [r.unsafe.headline, `Why: ${r.unsafe.reason}`, 'What you must do:', ...r.unsafe.mustDo.map((s) => `- ${s}`), ''] : []),
    `Hello ${r.customerName},`,
    '',
    `${r.company.name} visited your ${r.appliance.title.toLowerCase()} at ${r.appliance.address} on ${longDate(r.visit.visitedOn)} (${r.visit.what.toLowerCase()}).`,
    `Outcome: ${r.visit.outcomeWords}.`,
    ...r.readings.map((m) => `- ${m.reading}: ${m.value}, ${m.meaning}.`),
    '',
    `The full visit report is attached as a PDF. The appliance’s ${RECORD_WORDS.lifeRecord}, with every visit, is here:`,
    links.shareUrl,
    '',
    ...r.safetyNotes,
    '',
    `You get this e-mail because ${r.company.name} services your heating equipment. To stop e-mails from us, open: ${links.unsubscribeUrl}`,
  ];
}

export const visitReportText = (r: VisitReport, links: Links) => lines(r, links).join('\n') + '\n';

export function visitReportHtml(r: VisitReport, links: Links): string {
  const e = escapeHtml;
  return [
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${e(visitReportSubject(r))}</title></head>`,
    '<body style="font-family: sans-serif; line-height: 1.5; color: #1f2328;">',
    ...(r.unsafe
      ? [
          '<div style="border: 3px solid #a00; padding: 12px; margin-bottom: 16px;">',
          `<p><strong>${e(r.unsafe.headline)}</strong></p><p>Why: ${e(r.unsafe.reason)}</p><p><strong>What you must do:</strong></p>`,
          `<ul>${r.unsafe.mustDo.map((s) => `<li>${e(s)}</li>`).join('')}</ul></div>`,
        ]
      : []),
    `<p>Hello ${e(r.customerName)},</p>`,
    `<p>${e(r.company.name)} visited your ${e(r.appliance.title.toLowerCase())} at ${e(r.appliance.address)} on ${e(longDate(r.visit.visitedOn))} (${e(r.visit.what.toLowerCase())}).</p>`,
    `<p><strong>Outcome: ${e(r.visit.outcomeWords)}.</strong></p>`,
    r.readings.length ? `<ul>${r.readings.map((m) => `<li>${e(`${m.reading}: ${m.value}, ${m.meaning}.`)}</li>`).join('')}</ul>` : '',
    `<p>The full visit report is attached as a PDF. <a href="${e(links.shareUrl)}">Open the appliance’s ${RECORD_WORDS.lifeRecord}</a> to see every visit.</p>`,
    `<p>${r.safetyNotes.map(e).join('<br>')}</p>`,
    `<p style="font-size: 0.9em;">You get this e-mail because ${e(r.company.name)} services your heating equipment. <a href="${e(links.unsubscribeUrl)}">Stop e-mails from us</a>.</p>`,
    '</body></html>',
  ].join('\n');
}
