import type { DbOrTx } from '../../db/client';
import { LABELS } from '../../../shared/schemas/enums';
import type { HomeownerViewDto } from '../../../shared/schemas/homeowner';
import { addMonths } from '../../../shared/trade/iso-date';
import { loadApplianceRecord } from '../appliances';
import { typeLabelFor } from '../../core/type-label';
import { homeownerRepository as repo } from './homeowner.repository';
import { readingsInWords } from './readings-in-words';
import { nextHomeownerBookingOf } from '../booking-notices';
import { outcomeWords } from '../../../shared/glossary/outcomes';
import { findCompanyContact } from '../../core/tenant-finders';

/** "is" or "are" for a part's name: "ignition electrodes", "burners" are plural; "gas valve", "cad cell" are not. */
export function isOrAre(part: string): 'is' | 'are' {
  // The name before any explanation in brackets or a spec after a comma: "burners (main)", "electrodes, pair".
  const head = part.replace(/\s*\(.*\)/, '').split(',')[0].trim();
  return /[^su]s$/.test(head) ? 'are' : 'is';
}

export const MEANING = {
  replacement: (part: string) =>
    `The ${part} ${isOrAre(part)} due to be replaced. ${isOrAre(part) === 'are' ? 'They wear' : 'It wears'} with age or ${isOrAre(part) === 'are' ? 'have' : 'has'} shown wear; your technician will replace ${isOrAre(part) === 'are' ? 'them' : 'it'}.`,
  inspection: (part: string) => `The ${part} ${isOrAre(part)} due to be checked at the next service.`,
};

/**
 * What a homeowner may read about one appliance. It is built field by field from the record, so office notes,
 * technician-only fields and other customers' data can never slip through.
 */
export async function buildHomeownerView(db: DbOrTx, companyId: string, applianceId: string): Promise<HomeownerViewDto> {
  const record = await loadApplianceRecord(db, companyId, applianceId);
  const [company, visitRows, photoRows, nextBooking] = await Promise.all([
    findCompanyContact(db, companyId),
    repo.completedVisits(db, companyId, applianceId),
    repo.visiblePhotos(db, companyId, applianceId),
    nextHomeownerBookingOf(db, companyId, applianceId),
  ]);
  const swaps = await repo.swapsFor(
    db,
    companyId,
    visitRows.map((v) => v.id),
  );
  const a = record.appliance;
  const lastAnnual = visitRows.find((v) => v.type === 'annual_maintenance');

  return {
    company,
    appliance: {
      title: `${LABELS.applianceKind[a.kind]}, ${LABELS.fuel[a.fuel].toLowerCase()}`,
      makeAndModel: [a.manufacturer, a.model].filter(Boolean).join(' ') || null,
      location: a.location,
      address: `${record.site.street}, ${record.site.town}`,
      installedOn: a.installedOn,
      ageYears: record.ageYears,
      kind: a.kind,
      fuel: a.fuel,
    },
    unsafe: record.unsafe && { visitedOn: record.unsafe.visitedOn, reason: record.unsafe.reason },
    nextBooking,
    nextAnnualServiceDue: lastAnnual ? addMonths(lastAnnual.visitedOn, 12) : null,
    comingDue: record.due
      .filter((d) => d.status !== 'ok')
      .map((d) => ({
        part: d.typeLabel,
        what: d.kind === 'replacement' ? 'replace' : 'inspect',
        dueOn: d.dueOn,
        meaning: MEANING[d.kind](d.typeLabel),
      })),
    lifeExpectancy:
      record.endOfLife?.medianYears && record.ageYears !== null
        ? `Boilers like this one last about ${record.endOfLife.medianYears} years on average (a median: half last longer). Yours is ${record.ageYears} years old.`
        : null,
    visits: visitRows.map((v) => {
      const { words, numbers } = readingsInWords(v.results);
      const checked = [...new Set(v.checklist.filter((i) => i.mark === 'done').map((i) => i.section))];
      return {
        id: v.id,
        visitedOn: v.visitedOn,
        what: LABELS.visitType[v.type],
        outcome: v.outcome,
        outcomeWords: outcomeWords(v.outcome, v.outcomeReason),
        checked,
        replaced: swaps.filter((s) => s.visitId === v.id).map((s) => ({ part: s.label ?? typeLabelFor(s.typeCode), reason: s.reason })),
        findings: v.findings,
        recommendations: v.recommendations,
        readingsInWords: words,
        readings: numbers,
      };
    }),
    photos: photoRows.map((p) => ({ id: p.id, caption: p.caption, kind: p.kind, takenOn: p.createdAt.toISOString().slice(0, 10) })),
  };
}
