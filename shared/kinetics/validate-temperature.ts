import { KineticsInputError } from './kinetics-input-error';

/**
 * Checks an absolute temperature.
 *
 * @param functionName the public function on whose behalf the check runs (it starts the message)
 * @param temperatureKelvin the temperature, K
 * @throws {KineticsInputError} when it is not a finite positive number
 * @returns nothing
 * @example
 * validateTemperature('deltaDeltaGActivation', 298.15); // passes
 */
export function validateTemperature(functionName: string, temperatureKelvin: number): void {
  if (!(Number.isFinite(temperatureKelvin) && temperatureKelvin > 0)) {
    throw new KineticsInputError(`${functionName} requires a finite, positive temperature in kelvin`);
  }
}
