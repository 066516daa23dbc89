/**
 * The part of jstat 1.9.6 the statistics module uses. jstat ships no types; declaring only what
 * we call keeps the compiler checking our calls without pretending to describe the whole library.
 *
 * @example
 * import jStat from 'jstat';
 * jStat.normal.inv(0.975, 0, 1); // 1.959964
 */
declare module 'jstat' {
  interface JStatStatic {
    normal: {
      cdf(x: number, mean: number, sd: number): number;
      inv(p: number, mean: number, sd: number): number;
    };
    studentt: {
      cdf(x: number, dof: number): number;
      inv(p: number, dof: number): number;
    };
    chisquare: {
      cdf(x: number, dof: number): number;
      inv(p: number, dof: number): number;
    };
  }
  const jStat: JStatStatic;
  export default jStat;
}
