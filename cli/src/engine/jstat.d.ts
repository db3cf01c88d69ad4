// Minimal typing of the parts of the untyped `jstat` package that the engine uses.
declare module 'jstat' {
  interface StudentTDistribution {
    cdf(x: number, dof: number): number;
    pdf(x: number, dof: number): number;
    inv(p: number, dof: number): number;
  }
  interface JStatStatic {
    readonly studentt: StudentTDistribution;
    ibeta(x: number, a: number, b: number): number;
    gammaln(x: number): number;
  }
  const jStat: JStatStatic;
  export default jStat;
}
