// svg-parser ships no types; the tests use only parse(), which returns the root node tree.
declare module 'svg-parser' {
  export function parse(source: string): unknown;
}
