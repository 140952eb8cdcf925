/** ml-regression-theil-sen ships no types; this is the part Nestkeeper uses. */
declare module 'ml-regression-theil-sen' {
  export class TheilSenRegression {
    constructor(x: number[], y: number[]);
    /** The median of the pairwise slopes. */
    slope: number;
    /** The median of y − slope·x. */
    intercept: number;
    predict(x: number): number;
  }
}
