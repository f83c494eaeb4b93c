declare module 'jstat' {
  interface Distribution2 {
    cdf(x: number, a: number): number;
    inv(p: number, a: number): number;
  }
  interface Distribution3 {
    cdf(x: number, a: number, b: number): number;
    inv(p: number, a: number, b: number): number;
  }
  interface JStat {
    studentt: Distribution2;
    centralF: Distribution3;
    normal: Distribution3;
    erfc(x: number): number;
  }
  const jstat: { jStat: JStat };
  export default jstat;
}
