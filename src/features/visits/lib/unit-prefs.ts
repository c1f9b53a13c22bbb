import { useCallback, useSyncExternalStore } from 'react';
import { celsiusToFahrenheit, fahrenheitToCelsius, inWcToPascal, pascalToInWc } from '@shared/trade/units';

export type UnitPrefs = { temp: 'F' | 'C'; pressure: 'inwc' | 'pa' };

const KEY = 'lifeplate:units';
const DEFAULT: UnitPrefs = { temp: 'F', pressure: 'inwc' };
const listeners = new Set<() => void>();
let cached: UnitPrefs | null = null;

function read(): UnitPrefs {
  if (cached) return cached;
  try {
    const stored = JSON.parse(localStorage.getItem(KEY) ?? 'null') as Partial<UnitPrefs> | null;
    cached = {
      temp: stored?.temp === 'C' ? 'C' : 'F',
      pressure: stored?.pressure === 'pa' ? 'pa' : 'inwc',
    };
  } catch {
    cached = DEFAULT;
  }
  return cached;
}

/** Per-device choice of units; readings are always stored in °F and in. w.c. */
export function useUnitPrefs() {
  const prefs = useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    read,
  );
  const set = useCallback((next: Partial<UnitPrefs>) => {
    cached = { ...read(), ...next };
    localStorage.setItem(KEY, JSON.stringify(cached));
    listeners.forEach((l) => l());
  }, []);
  return [prefs, set] as const;
}

export type Converter = { unit: string; toDisplay: (canonical: number) => number; fromDisplay: (shown: number) => number; digits: number };

const identity = (n: number) => n;

export const temperature = (p: UnitPrefs): Converter =>
  p.temp === 'C' ? { unit: '°C', toDisplay: fahrenheitToCelsius, fromDisplay: celsiusToFahrenheit, digits: 1 } : { unit: '°F', toDisplay: identity, fromDisplay: identity, digits: 1 };

export const pressure = (p: UnitPrefs): Converter =>
  p.pressure === 'pa' ? { unit: 'Pa', toDisplay: inWcToPascal, fromDisplay: pascalToInWc, digits: 1 } : { unit: 'in. w.c.', toDisplay: identity, fromDisplay: identity, digits: 3 };

export const plain = (unit: string, digits = 2): Converter => ({ unit, toDisplay: identity, fromDisplay: identity, digits });
