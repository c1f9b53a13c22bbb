import { describe, expect, it } from 'vitest';
import { completionRequirements, requirementDetails, shortLabel, type CompletionFacts } from '../../shared/visits/completion-requirements';
import { combustionReadings } from '../../shared/schemas/visits';

const checklist = [
  { key: 'lwco_test', label: 'Test the low-water cutoff for its type. Float type: blow down its chamber.', mark: 'done' as const },
  { key: 'combustion_test', label: 'Run a combustion test after several minutes of steady firing: O2, CO.', mark: 'done' as const },
];
const goodCombustion = { o2Pct: 7, coPpm: 50, flueTempF: 400, airTempF: 70 };

/** A visit that may be completed; each test breaks one thing. */
const complete = (over: Partial<CompletionFacts> = {}): CompletionFacts => ({
  type: 'annual_maintenance',
  checklist,
  readings: { combustion: goodCombustion, lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } },
  readingSkips: {},
  requiredReadings: ['combustion', 'lowWaterCutoff'],
  flags: [],
  lowWaterCutoffFailed: false,
  outcome: 'left_operating',
  outcomeReason: null,
  outcomeToldWhom: null,
  appliance: { construction: 'cast_iron' },
  ...over,
});
const fields = (f: CompletionFacts) => completionRequirements(f).map((r) => r.field);

describe('completionRequirements', () => {
  it('asks nothing more of a complete visit', () => {
    expect(completionRequirements(complete())).toEqual([]);
  });

  it('lists an empty visit: each unmarked step, each required reading, the outcome, in the order of the form', () => {
    const empty = complete({ checklist: checklist.map((c) => ({ ...c, mark: null })), readings: {}, outcome: null });
    expect(fields(empty)).toEqual(['checklist.lwco_test', 'checklist.combustion_test', 'readings.combustion', 'readings.lowWaterCutoff', 'outcome']);
    expect(completionRequirements(empty)[0]).toEqual({
      field: 'checklist.lwco_test',
      label: 'Test the low-water cutoff for its type',
      message: 'Mark this step: done, not applicable or needs attention.',
    });
  });

  it('counts a block with only blanks in it as not taken', () => {
    expect(fields(complete({ readings: { combustion: { o2Pct: null, coPpm: '' }, lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } } }))).toEqual([
      'readings.combustion',
    ]);
  });

  it('accepts a skip with a reason, refuses one without, and lets a taken reading stand over a skip', () => {
    expect(fields(complete({ readings: { lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } }, readingSkips: { combustion: 'Analyzer in repair.' } }))).toEqual([]);
    const noReason = complete({ readings: { lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } }, readingSkips: { combustion: '  ' } });
    expect(completionRequirements(noReason)).toEqual([
      { field: 'readingSkips.combustion', label: 'Combustion test', message: 'Say why the combustion test was not taken.' },
    ]);
    expect(fields(complete({ readingSkips: { combustion: '' } }))).toEqual([]);
  });

  it('never requires a burner reading of an electric boiler', () => {
    expect(fields(complete({ readings: {}, appliance: { construction: 'electric' } }))).toEqual(['readings.lowWaterCutoff']);
  });

  it('lists a half-filled block and out-of-range values by field, as the schema words them', () => {
    const typed = complete({ readings: { combustion: { o2Pct: 25, coPpm: 40 }, lowWaterCutoff: { type: 'float', trippedWith: 'water_visible', burnerStopped: true } } });
    expect(requirementDetails(completionRequirements(typed))).toEqual({
      'readings.combustion.o2Pct': ['O2 must be at least 0 and below 20.9 % (the analyzer O2 range; 20.9 % is air).'],
      'readings.combustion.flueTempF': ['Flue temperature must be a number.'],
      'readings.combustion.airTempF': ['Combustion-air temperature must be a number.'],
    });
  });

  it('adds the errors the caller knows of (text typed where a number belongs), once each', () => {
    const f = complete({ readingErrors: { 'readings.combustion.coPpm': ['Type a number, like 8.5.'], 'readings.gasInput': ['clock one revolution'] } });
    expect(completionRequirements(f)).toEqual([
      { field: 'readings.combustion.coPpm', label: 'Combustion test', message: 'Type a number, like 8.5.' },
      { field: 'readings.gasInput', label: 'Gas input (meter clocked)', message: 'clock one revolution' },
    ]);
  });

  it('refuses a flue colder than the combustion air, and a flue outside −40…1,200 °F with the range', () => {
    // common practice: at steady firing the flue gas is heated by the fire; it cannot leave colder than the air it came from.
    const cold = complete({ readings: { ...complete().readings, combustion: { ...goodCombustion, flueTempF: 60, airTempF: 68 } } });
    expect(requirementDetails(completionRequirements(cold))).toEqual({
      'readings.combustion.flueTempF': ['Flue temperature 60 °F is below the combustion-air temperature 68 °F: impossible at steady firing. Check the probe is in the flue and read again.'],
    });
    // common practice: residential boiler flue gas runs roughly 250–600 °F; over 1,200 °F the probe is in the flame.
    for (const flueTempF of [1200.5, -40.5]) {
      expect(combustionReadings.safeParse({ ...goodCombustion, flueTempF, airTempF: -40 }).error?.issues.map((i) => i.message)).toEqual([
        'Flue temperature must be between −40 and 1,200 °F (−40 and 649 °C).',
      ]);
    }
    expect(combustionReadings.safeParse({ ...goodCombustion, flueTempF: 1200 }).success).toBe(true);
    expect(combustionReadings.safeParse({ ...goodCombustion, flueTempF: 70, airTempF: 70 }).success).toBe(true);
  });

  it('a warning or a stop needs the outcome, who was told and what they were told', () => {
    const warning = { severity: 'warning' as const, message: 'Flue CO 120 ppm: service required.' };
    expect(fields(complete({ flags: [warning], outcome: null }))).toEqual(['outcome', 'outcomeReason', 'outcomeToldWhom']);
    expect(fields(complete({ flags: [warning] }))).toEqual(['outcomeReason', 'outcomeToldWhom']);
    expect(fields(complete({ flags: [warning], outcomeReason: 'Burners need cleaning; booked.', outcomeToldWhom: 'Tenant' }))).toEqual([]);
    expect(fields(complete({ lowWaterCutoffFailed: true, outcomeToldWhom: 'Owner' }))).toEqual(['outcomeReason']);
    // An info flag is a note, not a warning.
    expect(fields(complete({ flags: [{ severity: 'info', message: 'Flue CO 30 ppm: service recommended.' }] }))).toEqual([]);
  });

  it('"shut down as unsafe" needs why and who was told, with or without a flag', () => {
    const shut = completionRequirements(complete({ outcome: 'shut_down_unsafe' }));
    expect(requirementDetails(shut)).toEqual({ outcomeReason: ['Say why the appliance was shut down.'], outcomeToldWhom: ['Say who was told it is shut down.'] });
  });

  it('puts the step’s short name in the server’s message', () => {
    const details = requirementDetails(completionRequirements(complete({ checklist: [{ ...checklist[0], mark: null }] })));
    expect(details).toEqual({ 'checklist.lwco_test': ['“Test the low-water cutoff for its type”: Mark this step: done, not applicable or needs attention.'] });
    expect(shortLabel('Check the siphon loop (pigtail) under the pressure control; clear.')).toBe('Check the siphon loop (pigtail) under the pressure control');
  });
});
