// The few jstat functions Rungs calls (the package ships no type declarations).
declare module 'jstat' {
  interface ContinuousDistribution {
    cdf(x: number, ...params: number[]): number;
    inv(p: number, ...params: number[]): number;
  }
  export const studentt: ContinuousDistribution;
  export const normal: ContinuousDistribution;
  export const noncentralt: { cdf(x: number, dof: number, ncp: number): number };
}
