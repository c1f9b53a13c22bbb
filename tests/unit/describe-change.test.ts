import { describe, expect, it } from 'vitest';
import { describeAmendment, describeChange, fieldWords, readingChanges, type VisitState } from '../../shared/audit/describe-change';

const signedOff: VisitState = {
  outcome: 'left_operating',
  outcomeReason: null,
  findings: 'Cleaned the burners.',
  recommendations: '',
  readings: { combustion: { o2Pct: 7, coPpm: 50, flueTempF: 400, airTempF: 70 }, steamOperatingPsi: 1.5 },
};

describe('the history of changes in words', () => {
  it('tells an amended CO reading from its old value to its new one, with the reason as the why', () => {
    const { words, next } = describeAmendment(
      { reason: 'Re-read the analyzer.', changes: { readings: { combustion: { o2Pct: 7, coPpm: 120, flueTempF: 400, airTempF: 70 } } } },
      signedOff,
    );
    expect(words).toEqual({ what: 'Amended the CO reading', details: ['Changed the CO reading from 50 ppm to 120 ppm.'], why: 'Re-read the analyzer.' });
    expect((next.readings.combustion as { coPpm: number }).coPpm).toBe(120);
    // The signed-off state is left as it was: the next amendment is told against `next`.
    expect((signedOff.readings.combustion as { coPpm: number }).coPpm).toBe(50);
  });

  it('tells an outcome change against the amendment before it', () => {
    const first = describeAmendment({ reason: 'Cracked section found.', changes: { outcome: { outcome: 'shut_down_unsafe', outcomeReason: 'Cracked section.' } } }, signedOff);
    expect(first.words.what).toBe('Amended the outcome');
    expect(first.words.details).toContain('Changed the outcome from left operating to shut down as unsafe.');
    const second = describeAmendment({ reason: 'Section was sound after all.', changes: { outcome: { outcome: 'left_operating' } } }, first.next);
    expect(second.words.details).toEqual(['Changed the outcome from shut down as unsafe to left operating.']);
  });

  it('names several corrected things in one sentence', () => {
    const { words } = describeAmendment({ reason: 'Typos.', changes: { findings: 'Cleaned the burners and pilot.', readings: { steamOperatingPsi: 2 } } }, signedOff);
    expect(words.what).toBe('Amended the findings and the steam operating pressure');
    expect(words.details).toEqual(['Changed the findings from “Cleaned the burners.” to “Cleaned the burners and pilot.”.', 'Changed the steam operating pressure from 1.5 psi to 2 psi.']);
  });

  it('lists only the readings that differ', () => {
    expect(readingChanges({ combustion: { o2Pct: 7, coPpm: 50 } }, { combustion: { o2Pct: 7, coPpm: 50 } })).toEqual([]);
    expect(readingChanges({}, { thermocouple: { openCircuitMv: 24 } }).map((r) => r.sentence)).toEqual(['Changed the open-circuit millivolts from nothing to 24 mV.']);
  });

  it('gives every row a sentence and never its code', () => {
    expect(describeChange({ action: 'complete', entity: 'visit', changes: { outcome: 'left_operating' } })).toEqual({ what: 'Completed the visit', details: ['Outcome: left operating.'], why: null });
    expect(describeChange({ action: 'update', entity: 'appliance', changes: { location: 'Cellar', burnerCount: 3 } }).what).toBe("Changed the record's location and burner count");
    expect(describeChange({ action: 'create', entity: 'component', changes: { typeCode: 'hot_surface_igniter' } }).what).toBe('Added a part: hot-surface igniter');
    expect(describeChange({ action: 'create', entity: 'makeup_water_entry', changes: { kind: 'added_by_hand', gallons: 2, note: 'topped up' } })).toEqual({
      what: 'Recorded water added by hand: 2 gal',
      details: [],
      why: 'topped up',
    });
    const unknown = describeChange({ action: 'frobnicate', entity: 'widget_thing', changes: null });
    expect(unknown.what).toBe('Made a change to the widget thing');
    expect(unknown.what).not.toMatch(/_/);
    expect(fieldWords('inputBtuh')).toBe('input Btu/h');
  });
});
