/**
 * The downloadable CSV template: header with units in brackets and one example row (an invented
 * timber joist). Columns not needed by a member stay empty.
 */
const TEMPLATE_COLUMNS: [string, string][] = [
  ["mark", "J1"],
  ["category", "floor_beam"],
  ["quantity", "24"],
  ["material", "timber-c24"],
  ["creep", "SC1"],
  ["section", "rectangle"],
  ["b [mm]", "47"],
  ["h [mm]", "200"],
  ["t [mm]", ""],
  ["d [mm]", ""],
  ["bf [mm]", ""],
  ["tf [mm]", ""],
  ["tw [mm]", ""],
  ["span_1 [m]", "3.9"],
  ["span_2 [m]", ""],
  ["overhang_left [m]", ""],
  ["overhang_right [m]", ""],
  ["supports", "pinned roller"],
  ["spring_stiffness [kN/mm]", ""],
  ["tributary_width [m]", "0.4"],
  ["dead_area_load [kPa]", "0.5"],
  ["live_area_load [kPa]", "1.5"],
  ["dead_uniform [kN/m]", ""],
  ["live_uniform [kN/m]", ""],
  ["live_point [kN]", ""],
  ["live_point_at [m]", ""],
  ["self_weight", "yes"],
  ["notes", "level 2, bay 3"],
];

function quoteCell(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

/** Returns the template text (comma-delimited, CRLF line ends as spreadsheets write them). */
export function buildCsvTemplate(): string {
  const header = TEMPLATE_COLUMNS.map(([name]) => quoteCell(name)).join(",");
  const example = TEMPLATE_COLUMNS.map(([, value]) => quoteCell(value)).join(",");
  return `${header}\r\n${example}\r\n`;
}
