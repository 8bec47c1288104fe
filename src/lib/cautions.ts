// The cautions of the product specification (§12), shown wherever a decision about product quality is supported.
export const REPORT_CAUTIONS = [
  "Statistical signals and yields in this report support the fab's quality system; they never replace its disposition procedures.",
  "Limits and releases follow the fab's own procedures and the agreement with the customer.",
  "Lotwarden only reads probe data: it never drives probe stations or source-measure units, whose high voltages and hot chucks are handled under local safety rules.",
] as const;
