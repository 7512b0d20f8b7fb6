// The part of jstat's API the tests use (jstat ships no type declarations).
declare module 'jstat' {
  export const jStat: {
    normal: { inv(p: number, mean: number, sd: number): number };
  };
}
