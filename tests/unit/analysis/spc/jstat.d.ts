// Minimal typings for the parts of jstat (npm, MIT) the SPC tests use as an independent reference;
// the package ships no types of its own.
declare module 'jstat' {
  interface JStat {
    normal: {
      cdf(x: number, mean: number, sd: number): number;
      inv(p: number, mean: number, sd: number): number;
    };
    gammafn(x: number): number;
    mean(values: number[]): number;
    stdev(values: number[], sample?: boolean): number;
    variance(values: number[], sample?: boolean): number;
    range(values: number[]): number;
  }
  const jStat: JStat;
  export default jStat;
}
