import { createPdfWriter } from '../../lib/pdf-writer';
import { explainSteps } from '../../../shared/glossary/visit-steps';
import type { VisitReport } from './visit-report-content';

const longDate = (iso: string) =>
  new Intl.DateTimeFormat('en-US', { timeZone: 'UTC', year: 'numeric', month: 'long', day: 'numeric' }).format(new Date(`${iso}T00:00:00Z`));

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

export const visitReportFilename = (r: VisitReport) => `visit-report-${r.visit.visitedOn}.pdf`;

/** The one-page visit report left with the household. A shut-down appliance is said first, in a box. */
export async function renderVisitReportPdf(r: VisitReport): Promise<Uint8Array> {
  const w = await createPdfWriter(`Visit report, ${r.visit.visitedOn}`);
  if (r.unsafe) {
    w.boxed(() => {
      w.text(r.unsafe!.headline, { size: 14, bold: true, color: [0.6, 0, 0] });
      w.text(`Why: ${r.unsafe!.reason}`, { size: 10, bold: true });
      w.text('What you must do:', { size: 10, bold: true });
      for (const step of r.unsafe!.mustDo) w.bullet(step);
    });
    w.space(6);
  }
  w.text(`Visit report: ${r.visit.what}, ${longDate(r.visit.visitedOn)}`, { size: 16, bold: true, gapAfter: 4 });
  w.text(`${r.company.name}, ${r.company.phone}`, { size: 10 });
  w.text(`For ${r.customerName}, ${r.appliance.address}`, { size: 10 });
  const about = [r.appliance.title, r.appliance.makeAndModel, r.appliance.location && `in the ${r.appliance.location}`].filter(Boolean).join(', ');
  w.text(`Appliance: ${about}${r.appliance.ageYears !== null ? ` (${r.appliance.ageYears} years old)` : ''}`, { size: 10 });
  if (r.visit.technicians.length) w.text(`Technician: ${r.visit.technicians.join(', ')}`, { size: 10 });

  w.heading(`Outcome: ${r.visit.outcomeWords}`);
  if (r.findings.trim()) w.text(`What was done: ${r.findings}`);
  if (r.recommendations.trim()) w.text(`Recommended: ${r.recommendations}`);
  for (const why of r.corrections) w.text(`Corrected after the visit: ${why}`, { size: 9 });

  if (r.readings.length) {
    w.heading('Readings and what they mean');
    for (const m of r.readings) w.bullet(`${m.reading}: ${m.value}, ${m.meaning}.`);
  }
  if (r.swaps.length) {
    w.heading('Parts replaced');
    for (const s of r.swaps) {
      const age = s.removedAgeYears !== null ? `the old one was ${s.removedAgeYears} ${s.removedAgeYears === 1 ? 'year' : 'years'} old` : 'age of the old one not known';
      w.bullet(`${capital(s.part)}${s.fitted ? ` (new: ${s.fitted})` : ''}: ${age}${s.reason ? `; reason: ${s.reason}` : ''}.`);
    }
  }
  if (r.checklist.length) {
    w.heading('What we checked');
    const sections = [...new Set(r.checklist.map((c) => c.section))];
    for (const { step, why } of explainSteps(sections)) {
      w.text(why ? `${step}: ${why}` : step, { size: 10, bold: true, gapAfter: 1 });
      for (const c of r.checklist.filter((i) => i.section === step)) w.bullet(`${capital(c.result)}: ${c.label}`);
    }
  }
  w.heading('Coming due');
  if (r.nextAnnualServiceDue) w.bullet(`Next yearly service: ${longDate(r.nextAnnualServiceDue)}.`);
  for (const d of r.comingDue) w.bullet(`${d.part}: ${d.what} by ${longDate(d.dueOn)}.`);
  if (!r.nextAnnualServiceDue && !r.comingDue.length) w.bullet('Nothing is due in the next 30 days.');

  w.heading('For your safety', 10);
  for (const note of r.safetyNotes) w.bullet(note);
  return w.save();
}
