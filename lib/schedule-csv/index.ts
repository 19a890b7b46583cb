export { createCsvRowMapper } from "./row-mapper";
export type { CsvMapperOptions, CsvRowError, CsvRowMapper, CreateMapperResult, PublicMember } from "./row-mapper";
export { CSV_DELIMITER_CHARS, CSV_DELIMITERS, findDelimiterInSingleColumnHeader, isCsvDelimiter } from "./delimiters";
export type { CsvDelimiter, CsvDelimiterName } from "./delimiters";
export { CSV_ROW_LIMITS, mapCsvRecordsToSchedule, mapIssueToCsvRow, parseScheduleCsv } from "./parse-schedule-csv";
export type { CsvMemberRecord, CsvRowPlace, CsvScheduleFields, MapCsvRecord, ParseScheduleCsvOptions, ParseScheduleCsvResult } from "./parse-schedule-csv";
export { buildCsvTemplate } from "./template";
export { MAX_CSV_CELL_CHARS, readCsvRecords, stripBom, type CsvRecord, type CsvRecordLimits } from "./read-csv-records";
export { FIXED_COLUMNS, LOAD_COLUMNS } from "./columns";
