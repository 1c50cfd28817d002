import { ZERO_CELSIUS_KELVIN } from '@shared/kinetics/units';

/**
 * Converts a temperature from the API (°C) to the stored unit (K).
 *
 * @param temperatureCelsius e.g. 37
 * @returns e.g. 310.15
 * @example kelvinFromCelsius(25) // 298.15
 */
export function kelvinFromCelsius(temperatureCelsius: number): number {
  return temperatureCelsius + ZERO_CELSIUS_KELVIN;
}

/**
 * Converts a stored temperature (K) to °C for the API, rounded to 1e-6 °C so that binary noise
 * (310.15 − 273.15 = 37.000000000000014) does not reach the client.
 *
 * @param temperatureKelvin e.g. 310.15
 * @returns e.g. 37
 * @example celsiusFromKelvin(310.15) // 37
 */
export function celsiusFromKelvin(temperatureKelvin: number): number {
  return Math.round((temperatureKelvin - ZERO_CELSIUS_KELVIN) * 1e6) / 1e6;
}
