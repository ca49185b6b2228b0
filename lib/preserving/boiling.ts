import { ALTITUDE_RULE, checkNumber, outsideTable, RULES } from './errors';

/**
 * Boiling point of water at an altitude:
 * 1. Air pressure from the U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), troposphere layer:
 *    P = P0 · (1 − L·H/T0)^(g0·M0/(R*·L)), with H the geopotential height.
 * 2. Saturation temperature at that pressure from IAPWS-IF97 region 4 (the "backward" equation
 *    T_s(p), IAPWS Revised Release on IF97, 2007, eq. 31).
 */

// U.S. Standard Atmosphere, 1976, Table 1 and eq. 33a.
const P0 = 101325; // Pa
const T0 = 288.15; // K
const L = 0.0065; // K/m
const G0 = 9.80665; // m/s²
const M0 = 0.0289644; // kg/mol
const R_STAR = 8.31432; // J/(mol·K), the 1976 standard's value
const R0 = 6356766; // m, effective Earth radius for geopotential height
const EXPONENT = (G0 * M0) / (R_STAR * L); // ≈ 5.255 88
/** The troposphere layer ends at 11,000 m geopotential (about 36,150 ft). */
const MAX_MODEL_FT = 36000;

export const FT_PER_M = 1 / 0.3048;

/** Air pressure (Pa) at a geometric altitude in metres, 1976 standard atmosphere. */
export function standardPressurePa(altitudeM: number): number {
  const h = (R0 * altitudeM) / (R0 + altitudeM);
  return P0 * (1 - (L * h) / T0) ** EXPONENT;
}

// IAPWS-IF97 region 4 coefficients n1…n10.
const N = [
  0, 0.11670521452767e4, -0.72421316598261e6, -0.17073846940092e2, 0.1202082470247e5, -0.32325550322333e7, 0.1491510861353e2, -0.48232657361591e4,
  0.40511340542057e6, -0.23855557567849, 0.65017534844798e3,
];

/** Saturation temperature (K) of water at pressure p (Pa), IAPWS-IF97 eq. 31. Valid 611.213 Pa – 22.064 MPa. */
export function saturationTemperatureK(pressurePa: number): number {
  const beta = (pressurePa / 1e6) ** 0.25;
  const e = beta * beta + N[3] * beta + N[6];
  const f = N[1] * beta * beta + N[4] * beta + N[7];
  const g = N[2] * beta * beta + N[5] * beta + N[8];
  const d = (2 * g) / (-f - Math.sqrt(f * f - 4 * e * g));
  return (N[10] + d - Math.sqrt((N[10] + d) ** 2 - 4 * (N[9] + N[10] * d))) / 2;
}

/** Saturation pressure (Pa) of water at temperature T (K), IAPWS-IF97 eq. 30. Valid 273.15–647.096 K. */
export function saturationPressurePa(temperatureK: number): number {
  const theta = temperatureK + N[9] / (temperatureK - N[10]);
  const a = theta * theta + N[1] * theta + N[2];
  const b = N[3] * theta * theta + N[4] * theta + N[5];
  const c = N[6] * theta * theta + N[7] * theta + N[8];
  return ((2 * c) / (-b + Math.sqrt(b * b - 4 * a * c))) ** 4 * 1e6;
}

const kToF = (k: number) => ((k - 273.15) * 9) / 5 + 32;

export type BoilingPointResult = { fahrenheit: number; celsius: number; pressurePa: number; source: string };

const SOURCE = 'U.S. Standard Atmosphere, 1976 (air pressure) and IAPWS-IF97 region 4 (saturation temperature)';

/** Boiling point of water at an altitude in the standard atmosphere (real weather moves it a little). */
export function boilingPoint({ altitudeFt }: { altitudeFt: number }): BoilingPointResult {
  const altitude = checkNumber(altitudeFt, ALTITUDE_RULE);
  if (altitude > MAX_MODEL_FT) {
    throw outsideTable(`The standard-atmosphere model used here covers altitudes up to ${MAX_MODEL_FT.toLocaleString('en-US')} ft.`, 'altitudeFt');
  }
  const pressurePa = standardPressurePa(altitude * 0.3048);
  const kelvin = saturationTemperatureK(pressurePa);
  return { fahrenheit: kToF(kelvin), celsius: kelvin - 273.15, pressurePa, source: SOURCE };
}

/** 1 psi in pascals, exact from 1 lb = 0.453 592 37 kg, g0 = 9.806 65 m/s² and 1 in = 0.0254 m. */
export const PA_PER_PSI = (0.45359237 * G0) / 0.0254 ** 2;

/** Temperature of saturated steam in a canner at a gauge pressure (psig) and altitude. */
export function cannerTemperature({ psig, altitudeFt }: { psig: number; altitudeFt: number }): { fahrenheit: number; celsius: number } {
  const gauge = checkNumber(psig, RULES.psig);
  const altitude = checkNumber(altitudeFt, ALTITUDE_RULE);
  const kelvin = saturationTemperatureK(standardPressurePa(altitude * 0.3048) + gauge * PA_PER_PSI);
  return { fahrenheit: kToF(kelvin), celsius: kelvin - 273.15 };
}
