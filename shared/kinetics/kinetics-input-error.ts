/**
 * Input a kinetics computation cannot work with (too few points, non-finite numbers, mismatched
 * weights, …). The message has a fixed form, `<functionName> requires <condition>`, so callers can show
 * it as is and tests can match it exactly; it is thrown before any arithmetic runs.
 *
 * @example
 * throw new KineticsInputError('fitMichaelisMenten requires a finite, positive enzyme concentration');
 */
export class KineticsInputError extends Error {
  override readonly name = 'KineticsInputError';
}
