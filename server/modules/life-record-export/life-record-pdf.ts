import sharp from 'sharp';
import { LABELS } from '../../../shared/schemas/enums';
import type { LifeRecordExport } from '../../../shared/schemas/life-record-export';
import { createPdfWriter } from '../../lib/pdf-writer';
import { SAFETY_NOTES } from '../visit-reports';
import { outcomeInSentence } from '../../../shared/glossary/outcomes';

const longDate = (iso: string) =>
  new Intl.DateTimeFormat('en-US', { timeZone: 'UTC', year: 'numeric', month: 'long', day: 'numeric' }).format(new Date(`${iso}T00:00:00Z`));

export type PdfPhoto = { jpeg: Buffer | null; caption: string };

/** Thumbnails re-encoded as baseline JPEG, the one raster format pdf-lib embeds besides PNG; a photo that will not decode is listed without its picture. */
export async function thumbnailForPdf(bytes: Buffer): Promise<Buffer | null> {
  try {
    return await sharp(bytes).resize({ width: 240, height: 240, fit: 'inside' }).jpeg({ quality: 80 }).toBuffer();
  } catch {
    return null;
  }
}

/** The life record as a document a household or a house buyer can keep. */
export async function renderLifeRecordPdf(doc: LifeRecordExport, photos: PdfPhoto[]): Promise<Uint8Array> {
  const a = doc.appliance;
  const title = `${LABELS.applianceKind[a.kind]}, ${LABELS.fuel[a.fuel].toLowerCase()}`;
  const w = await createPdfWriter(`Life record: ${title}`);
  w.text(`Life record: ${title}`, { size: 18, bold: true, gapAfter: 4 });
  w.text(a.address);
  w.text(`Kept by ${doc.recordedBy.name}, ${doc.recordedBy.phone}. Exported ${longDate(doc.exportedAt.slice(0, 10))}.`, { size: 9 });

  w.heading('Nameplate');
  const plate: [string, string | number | null][] = [
    ['Make and model', [a.manufacturer, a.model].filter(Boolean).join(' ') || null],
    ['Serial', a.serial],
    ['Construction', LABELS.construction[a.construction]],
    ['Installed', a.installedOn && longDate(a.installedOn)],
    ['Age', a.ageYears !== null ? `${a.ageYears} years` : null],
    ['Input', a.inputBtuPerHour !== null ? `${a.inputBtuPerHour.toLocaleString('en-US')} Btu/h` : null],
    ['Gross output', a.grossOutputBtuPerHour !== null ? `${a.grossOutputBtuPerHour.toLocaleString('en-US')} Btu/h` : null],
    ['Firing rate', a.firingRateGallonsPerHour !== null ? `${a.firingRateGallonsPerHour} gal/h` : null],
    ['Maximum working pressure', a.maxWorkingPressurePsi !== null ? `${a.maxWorkingPressurePsi} psi` : null],
    ['Location', a.location],
  ];
  for (const [label, value] of plate) if (value !== null && value !== '') w.bullet(`${label}: ${value}`);

  w.heading('Parts');
  if (!doc.components.length) w.bullet('No parts recorded.');
  for (const c of doc.components) {
    const age = c.ageYears !== null ? `${c.ageYears} years old${c.removedOn ? ' when removed' : ''}` : c.originalWithAppliance ? 'original with the appliance' : 'age not known';
    const state = c.removedOn ? `removed ${longDate(c.removedOn)}${c.removalReason ? ` (${c.removalReason})` : ''}` : c.due ? `${c.due.kind === 'replacement' ? 'replace' : 'check'} by ${longDate(c.due.dueOn)}` : 'in service';
    w.bullet(`${c.typeLabel}${c.description ? ` (${c.description})` : ''}: ${age}; ${state}.`);
  }

  w.heading('Visits');
  if (!doc.visits.length) w.bullet('No completed visits yet.');
  for (const v of doc.visits) {
    const outcome = v.outcome === 'shut_down_unsafe' && v.outcomeReason ? `${outcomeInSentence(v.outcome)}: ${v.outcomeReason}` : v.outcome ? outcomeInSentence(v.outcome) : 'completed';
    w.text(`${longDate(v.visitedOn)}: ${LABELS.visitType[v.type]}, ${outcome}`, { bold: true, gapAfter: 1 });
    if (v.findings.trim()) w.bullet(`Findings: ${v.findings}`);
    if (v.recommendations.trim()) w.bullet(`Recommended: ${v.recommendations}`);
    for (const m of v.readingsInWords) w.bullet(`${m.reading}: ${m.value}, ${m.meaning}.`);
    for (const s of v.partSwaps) w.bullet(`Replaced the ${s.part}${s.reason ? `: ${s.reason}` : ''}.`);
    for (const m of v.amendments) w.bullet(`Corrected on ${longDate(m.madeAt.slice(0, 10))}: ${m.reason}`);
    w.space(4);
  }

  if (photos.length) {
    w.heading('Photos');
    for (const p of photos) {
      if (p.jpeg) await w.image(p.jpeg, 160, p.caption);
      else w.bullet(p.caption);
    }
  }
  w.heading('For your safety', 10);
  for (const note of SAFETY_NOTES) w.bullet(note);
  return w.save();
}
