// Minimal typing for convert-units@2 (the package ships none); used only as a cross-check in tests.
declare module "convert-units" {
  interface Converter {
    from(unit: string): { to(unit: string): number };
  }
  function convert(value?: number): Converter;
  export default convert;
}
