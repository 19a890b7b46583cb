/**
 * The server's CSV reading: the body's bytes decoded as UTF-8 a slice at a time and fed to
 * papaparse's streaming parser, with the record handler the upload page uses (read-csv-records.ts).
 * Nothing but the members (or the errors) is kept, so memory stays near the body's own size
 * whatever the file holds; the row limits stop the reading as soon as they are passed.
 */
import { Readable } from "node:stream";

import Papa from "papaparse";

import { isCsvDelimiter } from "./delimiters";
import { CSV_ROW_LIMITS, createScheduleCsvReader, invalidDelimiter, type ParseScheduleCsvOptions, type ParseScheduleCsvResult } from "./parse-schedule-csv";
import { createLineEndNormaliser, createPapaReading, stripBom } from "./read-csv-records";

/** Bytes decoded per step. */
const SLICE_BYTES = 64 * 1024;

/**
 * A row longer than this stops the reading: papaparse re-reads an unfinished row with each new
 * slice, so an endless row would cost the square of its length.
 */
export const MAX_CSV_ROW_CHARS = 256 * 1024;

/** The bytes are not UTF-8 text; `message` says what they seem to be instead. */
export class CsvEncodingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CsvEncodingError";
  }
}

const SAVE_AS_UTF8 = "Save it as CSV UTF-8 from your spreadsheet program.";

function assertNotUtf16(bytes: Uint8Array): void {
  const [a, b] = bytes;
  if ((a === 0xff && b === 0xfe) || (a === 0xfe && b === 0xff)) throw new CsvEncodingError(`The file is UTF-16 text, which is not read. ${SAVE_AS_UTF8}`);
}

function* decodeSlices(bytes: Uint8Array): Generator<string> {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  for (let start = 0; start < bytes.length; start += SLICE_BYTES) {
    let text: string;
    try {
      text = decoder.decode(bytes.subarray(start, start + SLICE_BYTES), { stream: start + SLICE_BYTES < bytes.length });
    } catch {
      throw new CsvEncodingError(`The file is not UTF-8 text (it may be Windows-1252 or another legacy encoding). ${SAVE_AS_UTF8}`);
    }
    // UTF-16 without a byte-order mark decodes as UTF-8 with a NUL beside every Latin letter.
    if (text.includes("\u0000")) throw new CsvEncodingError(`The file contains NUL characters; it may be UTF-16 text, which is not read. ${SAVE_AS_UTF8}`);
    yield start === 0 ? stripBom(text) : text;
  }
}

/** Reads a CSV schedule from its bytes; throws CsvEncodingError for bytes that are not UTF-8 text. */
export async function parseScheduleCsvBytes(bytes: Uint8Array, options: ParseScheduleCsvOptions): Promise<ParseScheduleCsvResult> {
  const delimiter = options.delimiter ?? ",";
  if (!isCsvDelimiter(delimiter)) return invalidDelimiter();
  assertNotUtf16(bytes);
  const reader = createScheduleCsvReader(options, { compactCapacityBytes: bytes.byteLength });
  const reading = createPapaReading(delimiter, CSV_ROW_LIMITS, reader.sink);
  const normaliser = createLineEndNormaliser();
  let fedChars = 0;
  let encodingError: CsvEncodingError | null = null;
  function* feed(): Generator<string> {
    try {
      for (const slice of decodeSlices(bytes)) {
        if (reading.stopped()) return;
        if (fedChars - reading.consumedChars() > MAX_CSV_ROW_CHARS) return reading.stopOnLongRow(MAX_CSV_ROW_CHARS);
        const text = normaliser.push(slice);
        fedChars += text.length;
        yield text;
      }
      yield normaliser.end();
    } catch (error) {
      if (!(error instanceof CsvEncodingError)) throw error;
      encodingError = error;
    }
  }
  const input = Readable.from(feed(), { objectMode: true, highWaterMark: 1 });
  await new Promise<void>((resolve, reject) => {
    Papa.parse<string[]>(input, {
      ...reading.config,
      complete: () => {
        input.destroy();
        resolve();
      },
      error: (error) => reject(error),
    });
  });
  if (encodingError) throw encodingError;
  return reader.finish(reading.finish());
}
