export { createCsvRowMapper } from "./row-mapper";
export type { CsvMapperOptions, CsvRowError, CsvRowMapper, CreateMapperResult, PublicMember } from "./row-mapper";
export { CSV_DELIMITERS, mapIssueToCsvRow, parseScheduleCsv } from "./parse-schedule-csv";
export type { CsvDelimiter, CsvRowPlace, ParseScheduleCsvOptions, ParseScheduleCsvResult } from "./parse-schedule-csv";
export { buildCsvTemplate } from "./template";
export { stripBom, tokenizeCsv, type CsvRecord } from "./tokenize-csv";
export { FIXED_COLUMNS, LOAD_COLUMNS } from "./columns";
