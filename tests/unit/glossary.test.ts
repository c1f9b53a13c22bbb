import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  explainSteps,
  GENERIC_QUICK_REASONS,
  LABELS,
  OUTCOME_LABELS,
  outcomeInSentence,
  outcomeWords,
  partName,
  QUICK_REASONS,
  quickReasonsFor,
  RECORD_WORDS,
  VISIT_STEPS,
  visitStepWhy,
} from '../../shared/glossary';
import { APPLIANCE_KINDS, CHECK_MARKS, FUELS, VISIT_OUTCOMES, VISIT_TYPES } from '../../shared/schemas/enums';
import { IMPORT_STATUSES } from '../../shared/schemas/imports';
import { COMPONENT_TYPE_CODES } from '../../shared/trade/component-types';
import type { HomeownerViewDto } from '../../shared/schemas/homeowner';
import { DEFAULT_CHECKLISTS } from '../../server/modules/checklists/default-checklists';
import { sharePageMarkup } from '../../server/spa/share-page-markup';
import { visitReportHtml, visitReportText } from '../../server/modules/visit-reports/visit-report-mail';
import type { VisitReport } from '../../server/modules/visit-reports/visit-report-content';

const ROOT = path.resolve(import.meta.dirname, '../..');

function filesUnder(dir: string): string[] {
  return fs.readdirSync(path.join(ROOT, dir), { withFileTypes: true }).flatMap((e) => {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) return filesUnder(rel);
    return /\.(ts|tsx)$/.test(e.name) ? [rel] : [];
  });
}

const view = (outcome: HomeownerViewDto['visits'][number]['outcome'], checked: string[]): HomeownerViewDto => ({
  company: { name: 'Invented Heating Co', phone: '555-0100' },
  appliance: { title: 'Steam boiler, natural gas', makeAndModel: null, location: 'basement', address: '12 Example Lane, Testville', installedOn: null, ageYears: null, kind: 'steam_boiler', fuel: 'natural_gas' },
  unsafe: null,
  nextBooking: null,
  nextAnnualServiceDue: null,
  comingDue: [],
  lifeExpectancy: null,
  visits: [
    {
      id: '00000000-0000-4000-8000-000000000001',
      visitedOn: '2026-11-18',
      what: 'Annual maintenance',
      outcome,
      outcomeWords: outcomeWords(outcome, null),
      checked,
      replaced: [],
      findings: '',
      recommendations: '',
      readingsInWords: [],
      readings: {},
    },
  ],
  photos: [],
});

const report = (outcome: 'left_operating' | 'shut_down_unsafe'): VisitReport => ({
  company: { name: 'Invented Heating Co', phone: '555-0100' },
  customerName: 'Pat Example',
  appliance: { title: 'Steam boiler, natural gas', makeAndModel: null, location: null, address: '12 Example Lane, Testville', installedOn: null, ageYears: null },
  visit: { id: 'v', visitedOn: '2026-11-18', what: 'Annual maintenance', technicians: [], outcomeWords: outcomeWords(outcome, 'flame rollout')! },
  unsafe: null,
  findings: '',
  recommendations: '',
  corrections: [],
  checklist: [],
  readings: [],
  swaps: [],
  comingDue: [],
  nextAnnualServiceDue: null,
  safetyNotes: [],
  recipient: { customerId: 'c', email: null, optedOut: false, applianceId: 'a' },
});

describe('glossary: outcomes', () => {
  it('names every outcome, and the enum labels are the glossary’s', () => {
    for (const o of VISIT_OUTCOMES) expect(OUTCOME_LABELS[o]).toMatch(/^[A-Z][a-z ]+$/);
    expect(LABELS.visitOutcome).toBe(OUTCOME_LABELS);
    expect(OUTCOME_LABELS.left_operating).toBe('Left operating');
  });

  it('gives the household the same label the visit screen offers, with a shut-down’s reason after it', () => {
    expect(outcomeWords('left_operating', 'ignored')).toBe(OUTCOME_LABELS.left_operating);
    expect(outcomeWords('shut_down_unsafe', 'cracked heat exchanger')).toBe('Shut down as unsafe: cracked heat exchanger');
    expect(outcomeWords('shut_down_unsafe', null)).toBe('Shut down as unsafe: see the technician’s note');
    expect(outcomeWords(null, null)).toBeNull();
    expect(outcomeInSentence('left_operating')).toBe('left operating');
  });

  it('the share page, rendered from the client’s own components, shows the visit screen’s label', () => {
    const html = sharePageMarkup('tok', view('left_operating', []), { warn: () => {} });
    expect(html).toContain(`>${OUTCOME_LABELS.left_operating}<`);
    expect(html).toContain(`your appliance’s ${RECORD_WORDS.lifeRecord}`);
  });

  it('the visit-report e-mail uses the same labels', () => {
    const links = { shareUrl: 'https://example.test/s/x', unsubscribeUrl: 'https://example.test/u/x' };
    expect(visitReportText(report('left_operating'), links)).toContain(`Outcome: ${OUTCOME_LABELS.left_operating}.`);
    expect(visitReportHtml(report('left_operating'), links)).toContain(`Outcome: ${OUTCOME_LABELS.left_operating}.`);
    expect(visitReportText(report('shut_down_unsafe'), links)).toContain(`Outcome: ${OUTCOME_LABELS.shut_down_unsafe}: flame rollout.`);
    expect(visitReportText(report('left_operating'), links)).toContain(`The appliance’s ${RECORD_WORDS.lifeRecord}, with every visit`);
  });

  it('no screen, e-mail or PDF spells the old words out itself', () => {
    // The words that drifted: they may appear only in the glossary (and the import's reading of other systems' words).
    const allowed = new Set(['shared/imports/import-choices.ts', 'server/db/factories/import-csv.ts']);
    const drifted = /left running|service record|component catalog|'Left operating'|"Left operating"|>Left operating</i;
    const offenders = [...filesUnder('src'), ...filesUnder('server')].filter((f) => !allowed.has(f) && drifted.test(fs.readFileSync(path.join(ROOT, f), 'utf8')));
    expect(offenders).toEqual([]);
  });
});

describe('glossary: labels and part names', () => {
  it('labels every stored value a screen shows', () => {
    for (const k of APPLIANCE_KINDS) expect(LABELS.applianceKind[k]).toBeTruthy();
    for (const f of FUELS) expect(LABELS.fuel[f]).toBeTruthy();
    for (const v of VISIT_TYPES) expect(LABELS.visitType[v]).toBeTruthy();
    for (const m of CHECK_MARKS) expect(LABELS.checkMark[m]).toBeTruthy();
    for (const s of IMPORT_STATUSES) expect(LABELS.importStatus[s]).not.toMatch(/_/);
  });

  it('names a part by the company’s label, else the generic name, never by its code', () => {
    expect(partName('gas_valve')).toBe('gas valve');
    expect(partName('gas_valve', 'Combination gas valve')).toBe('Combination gas valve');
    expect(partName('zone_valve_actuator')).toBe('zone valve actuator');
    for (const code of COMPONENT_TYPE_CODES) expect(partName(code)).not.toContain('_');
  });
});

describe('glossary: quick reasons per part type', () => {
  it('every part type has its own quick reasons', () => {
    for (const code of COMPONENT_TYPE_CODES) expect(QUICK_REASONS[code].length).toBeGreaterThanOrEqual(2);
  });

  it('offers trade reasons that fit the part, and nothing of another part', () => {
    // common practice: what a technician finds wrong with each of these parts.
    expect(quickReasonsFor('thermocouple')).toEqual(expect.arrayContaining(['low millivolts', 'pilot drops out']));
    expect(quickReasonsFor('gauge_glass')).toEqual(expect.arrayContaining(['etched or cloudy', 'leaking at washers']));
    expect(quickReasonsFor('burners').join(' ')).not.toMatch(/glass|etched|millivolt/);
    expect(quickReasonsFor('nozzle').join(' ')).not.toMatch(/glass|pilot/);
  });

  it('falls back to generic reasons for a company’s own part type', () => {
    expect(quickReasonsFor('zone_valve_actuator')).toEqual(GENERIC_QUICK_REASONS);
    expect(quickReasonsFor('toString')).toEqual(GENERIC_QUICK_REASONS);
  });
});

describe('glossary: visit steps in plain words', () => {
  it('explains every step of the checklists companies start with', () => {
    const sections = [...new Set(DEFAULT_CHECKLISTS.flatMap((t) => t.items.map((i) => i.section)))];
    expect(sections.filter((s) => !visitStepWhy(s))).toEqual([]);
    for (const why of Object.values(VISIT_STEPS)) expect(why.length).toBeLessThanOrEqual(200);
  });

  it('keeps a company’s own step name as it is, without a line', () => {
    expect(explainSteps(['Carbon monoxide', 'Our own step'])).toEqual([
      { step: 'Carbon monoxide', why: VISIT_STEPS['Carbon monoxide'] },
      { step: 'Our own step', why: null },
    ]);
  });

  it('the share page shows each checked step with its plain line, not a bare list of trade terms', () => {
    const html = sharePageMarkup('tok', view('left_operating', ['Low-water cutoff', 'Our own step']), { warn: () => {} });
    expect(html).toContain('What we checked');
    expect(html).toContain('The safety switch that stops the burner if the boiler runs low on water');
    expect(html).toContain('Our own step');
    expect(html).not.toContain('Checked:');
  });
});
