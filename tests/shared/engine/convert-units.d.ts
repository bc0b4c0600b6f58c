// convert-units 2.3 ships no types; this is the part of its API the unit cross-checks use.
declare module 'convert-units' {
  interface Conversion {
    from(unit: string): { to(unit: string): number };
  }
  function convert(value: number): Conversion;
  export default convert;
}
