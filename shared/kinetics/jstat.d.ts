// jstat ships no type declarations; only the two functions the engine calls are declared, so nothing
// untyped leaks into shared code.
declare module 'jstat' {
  const jStat: {
    studentt: {
      /** Quantile of Student's t distribution with `degreesOfFreedom` degrees of freedom. */
      inv(probability: number, degreesOfFreedom: number): number;
    };
    /** Regularised incomplete beta function I_x(a, b). */
    ibeta(x: number, a: number, b: number): number;
  };
  export default jStat;
}
