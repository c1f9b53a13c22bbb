/** Unit conversions used by the trade computations. */

/** Conventional inch of water column (at 4 °C). Source: conventional value, 1 in. w.c. = 249.089 Pa. */
export const PASCAL_PER_IN_WC = 249.089;
/** from memory: NIST Special Publication 811 (2008), Appendix B: 1 psi = 6.894 757 kPa. */
export const KPA_PER_PSI = 6.894757;
/** International Table Btu. from memory: NIST Special Publication 811 (2008), Appendix B: 1 Btu(IT) = 1.055 056 kJ. */
export const KJ_PER_BTU = 1.055056;
/** from memory: NIST Special Publication 811 (2008), Appendix B: 1 lb = 0.453 592 37 kg (exact). */
export const KG_PER_LB = 0.45359237;

export const fahrenheitToCelsius = (degF: number): number => ((degF - 32) * 5) / 9;
export const celsiusToFahrenheit = (degC: number): number => (degC * 9) / 5 + 32;
export const fahrenheitToKelvin = (degF: number): number => fahrenheitToCelsius(degF) + 273.15;
/** A temperature difference (not a temperature) in °F converted to kelvin (= °C difference). */
export const fahrenheitDeltaToKelvin = (deltaF: number): number => (deltaF * 5) / 9;

export const inWcToPascal = (inWc: number): number => inWc * PASCAL_PER_IN_WC;
export const pascalToInWc = (pa: number): number => pa / PASCAL_PER_IN_WC;

export const psiToKpa = (psi: number): number => psi * KPA_PER_PSI;
export const kpaToPsi = (kpa: number): number => kpa / KPA_PER_PSI;
