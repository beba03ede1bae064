// The few jstat functions the tests use as an independent check (the package ships no types).
declare module 'jstat' {
  const jStat: {
    corrcoeff(a: number[], b: number[]): number;
    stdev(values: number[], sample?: boolean): number;
  };
  export default jStat;
}
