import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  airFreeCoPpm,
  analyzeCombustion,
  assessThermocoupleMillivolts,
  clockGasInput,
  co2PctFromO2,
  combustionSafetyFlags,
  excessAirPctFromO2,
  requireReading,
  siegertFlueLossPct,
  type ReadingName,
} from '../../../shared/trade/index';
import { readingsInput } from '../../../shared/schemas/visits';
import { READING_RANGES } from '../../../shared/trade/reading-ranges';
import { outOf, refusedOn } from './reading-guards';

const combustionBase = { fuel: 'natural_gas', o2Pct: 5, coPpm: 20, flueTempF: 400, airTempF: 70 } as const;
const gasBase = { dialCubicFeet: 1, secondsPerRevolution: 30, heatingValueBtuPerCubicFoot: 1026 };
const flagsBase = { coPpm: 20, coAirFreePpm: 25 };

// Every exported trade function that takes a reading, with the reading it takes.
const CASES: Array<[string, ReadingName, (v: number) => unknown]> = [
  ['analyzeCombustion o2Pct', 'o2Pct', (v) => analyzeCombustion({ ...combustionBase, o2Pct: v })],
  ['analyzeCombustion coPpm', 'coPpm', (v) => analyzeCombustion({ ...combustionBase, coPpm: v })],
  ['analyzeCombustion flueTempF', 'flueTempF', (v) => analyzeCombustion({ ...combustionBase, flueTempF: v, airTempF: -40 })],
  ['analyzeCombustion airTempF', 'airTempF', (v) => analyzeCombustion({ ...combustionBase, airTempF: v })],
  ['analyzeCombustion draftInWc', 'draftInWc', (v) => analyzeCombustion({ ...combustionBase, draftInWc: v })],
  ['analyzeCombustion ambientCoPpm', 'ambientCoPpm', (v) => analyzeCombustion({ ...combustionBase, ambientCoPpm: v })],
  ['analyzeCombustion spillageSeconds', 'spillageSeconds', (v) => analyzeCombustion({ ...combustionBase, spillageSeconds: v })],
  ['siegertFlueLossPct o2Pct', 'o2Pct', (v) => siegertFlueLossPct({ ...combustionBase, o2Pct: v })],
  ['siegertFlueLossPct flueTempF', 'flueTempF', (v) => siegertFlueLossPct({ ...combustionBase, flueTempF: v, airTempF: -40 })],
  ['siegertFlueLossPct airTempF', 'airTempF', (v) => siegertFlueLossPct({ ...combustionBase, airTempF: v })],
  ['excessAirPctFromO2', 'o2Pct', (v) => excessAirPctFromO2('natural_gas', v)],
  ['co2PctFromO2', 'o2Pct', (v) => co2PctFromO2('natural_gas', v)],
  ['airFreeCoPpm o2Pct', 'o2Pct', (v) => airFreeCoPpm(20, v)],
  ['airFreeCoPpm coPpm', 'coPpm', (v) => airFreeCoPpm(v, 5)],
  ['combustionSafetyFlags coPpm', 'coPpm', (v) => combustionSafetyFlags({ coPpm: v, coAirFreePpm: 1e6 })],
  ['combustionSafetyFlags draftInWc', 'draftInWc', (v) => combustionSafetyFlags({ ...flagsBase, draftInWc: v })],
  ['combustionSafetyFlags ambientCoPpm', 'ambientCoPpm', (v) => combustionSafetyFlags({ ...flagsBase, ambientCoPpm: v })],
  ['combustionSafetyFlags spillageSeconds', 'spillageSeconds', (v) => combustionSafetyFlags({ ...flagsBase, spillageSeconds: v })],
  ['clockGasInput dialCubicFeet', 'dialCubicFeet', (v) => clockGasInput({ ...gasBase, dialCubicFeet: v })],
  ['clockGasInput secondsPerRevolution', 'secondsPerRevolution', (v) => clockGasInput({ ...gasBase, secondsPerRevolution: v })],
  ['clockGasInput heatingValueBtuPerCubicFoot', 'heatingValueBtuPerCubicFoot', (v) => clockGasInput({ ...gasBase, heatingValueBtuPerCubicFoot: v })],
  ['assessThermocoupleMillivolts openCircuitMv', 'openCircuitMv', (v) => assessThermocoupleMillivolts({ openCircuitMv: v })],
  ['assessThermocoupleMillivolts closedCircuitMv', 'closedCircuitMv', (v) => assessThermocoupleMillivolts({ closedCircuitMv: v })],
];

describe('every trade function refuses out-of-range and non-finite readings', () => {
  it.each(CASES)('%s', (_label, name, call) => {
    fc.assert(fc.property(outOf(name), (v) => refusedOn(() => call(v)) === name));
  });

  it('the refusal names the range', () => {
    // common practice: analyzer O2 range 0–20.9 %
    expect(() => requireReading('o2Pct', 21)).toThrow(/at least 0 and below 20\.9 %/);
    // from memory: combustion analyzer spec sheets (CO to about 10,000 ppm)
    expect(() => requireReading('coPpm', 1e300)).toThrow(/from 0 to 10,000 ppm/);
  });
});

describe('the cases that used to compute', () => {
  it('O2 20.8 % with a hot flue is refused, not an efficiency of −3,265 %', () => {
    // Physics: flue losses cannot exceed the heat the fuel gives (efficiency > 0).
    expect(refusedOn(() => analyzeCombustion({ ...combustionBase, o2Pct: 20.8, flueTempF: 1200 }))).toBe('o2Pct');
    // The flue range ends at 1,200 °F (shared/trade/plausible-readings.ts, common practice).
    expect(refusedOn(() => analyzeCombustion({ ...combustionBase, o2Pct: 20.8, flueTempF: 1500 }))).toBe('flueTempF');
  });

  it('CO of 1e300 ppm is refused', () => {
    expect(refusedOn(() => analyzeCombustion({ ...combustionBase, coPpm: 1e300 }))).toBe('coPpm');
  });

  it('Siegert refuses O2 20.99 %, a flue colder than the air, and ±1e308', () => {
    expect(refusedOn(() => siegertFlueLossPct({ ...combustionBase, o2Pct: 20.99 }))).toBe('o2Pct');
    expect(refusedOn(() => siegertFlueLossPct({ ...combustionBase, flueTempF: 60, airTempF: 70 }))).toBe('flueTempF');
    expect(refusedOn(() => siegertFlueLossPct({ ...combustionBase, flueTempF: 1e308 }))).toBe('flueTempF');
    expect(refusedOn(() => siegertFlueLossPct({ ...combustionBase, airTempF: -1e308 }))).toBe('airTempF');
  });

  it('clocking with a vanishing time is refused, not Infinity', () => {
    expect(refusedOn(() => clockGasInput({ ...gasBase, secondsPerRevolution: 1e-320 }))).toBe('secondsPerRevolution');
  });
});

describe('the visit readings schema names the same range', () => {
  it('CO above the analyzer range is a field error naming it', () => {
    const parsed = readingsInput.safeParse({ combustion: { ...combustionBase, coPpm: 50_000 } });
    expect(parsed.success).toBe(false);
    const issue = parsed.error!.issues.find((i) => i.path.join('.') === 'combustion.coPpm');
    expect(issue?.message).toBe('CO must be from 0 to 10,000 ppm (the analyzer CO range).');
  });

  it.each([25, 20.9, -1])('O2 %s %% is a field error naming the analyzer range and air, as analyzeCombustion refuses it', (o2Pct) => {
    // from memory: combustion analyzer spec sheets (O2 cell 0–20.9 %); O2 of dry air 20.9 % (Method 19's figure)
    const parsed = readingsInput.safeParse({ combustion: { ...combustionBase, o2Pct } });
    const issue = parsed.error!.issues.find((i) => i.path.join('.') === 'combustion.o2Pct');
    expect(issue?.message).toBe('O2 must be at least 0 and below 20.9 % (the analyzer O2 range; 20.9 % is air).');
    expect(refusedOn(() => analyzeCombustion({ ...combustionBase, o2Pct }))).toBe('o2Pct');
  });

  it('O2 just below air passes the schema, the same bound the trade functions take', () => {
    const parsed = readingsInput.safeParse({ combustion: { ...combustionBase, o2Pct: 20.85 } });
    expect(parsed.error?.issues.find((i) => i.path.join('.') === 'combustion.o2Pct')).toBeUndefined();
    expect(READING_RANGES.o2Pct).toMatchObject({ min: 0, maxExclusive: 20.9 });
  });

  it('a seconds-per-revolution of 0 is a field error naming the range', () => {
    const parsed = readingsInput.safeParse({ gasInput: { ...gasBase, secondsPerRevolution: 0 } });
    const issue = parsed.error!.issues.find((i) => i.path.join('.') === 'gasInput.secondsPerRevolution');
    expect(issue?.message).toMatch(/from 0\.1 to 36,000 s/);
  });
});
