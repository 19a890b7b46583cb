/**
 * Offline schedule check: `npm run check -- FILE [--json] [--delimiter semicolon] [--profile ID] [--catalogue FILE]`.
 * Reads a JSON or CSV schedule, checks every member, prints a pass/fail table (or results JSON).
 * Exit codes: 0 every member passes, 1 any member fails, 2 bad input (every issue printed,
 * one per line as `path: message`), 3 an internal error.
 */
import { readFileSync } from "node:fs";
import { basename, extname } from "node:path";

import { checkSchedule, type CheckScheduleResult } from "../engine/check-schedule";
import { getDeflectionDirection } from "../engine/deflection-direction";
import type { CatalogueSection, CheckResult, InputIssue, MemberResult } from "../engine/model";
import { listPresetIds } from "../engine/presets";
import { convertFromInternal } from "../engine/units";
import { DELIMITERS, isDelimiterName, nameDeflectionCheck, FREQUENCY_CHECK_NAME, TERMS } from "../vocabulary";
import { mapIssueToCsvRow, parseScheduleCsv, stripBom, type CsvDelimiter, type CsvRowError, type CsvRowPlace } from "../schedule-csv";

const CAUTION = "Screening and review aid: the engineer of record and the governing local codes decide.";
const RESULTS_FORMAT = "sagline.results/v2";

class UsageError extends Error {}

interface CliArgs {
  file: string;
  json: boolean;
  delimiter: CsvDelimiter | null;
  profile: string | null;
  catalogue: string | null;
}

const USAGE = "usage: npm run check -- FILE [--json] [--delimiter comma | semicolon | tab] [--profile PROFILE_ID] [--catalogue FILE.json]";

function parseArgs(argv: string[]): CliArgs {
  const args: CliArgs = { file: "", json: false, delimiter: null, profile: null, catalogue: null };
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i] as string;
    const next = () => {
      const value = argv[++i];
      if (value === undefined) throw new UsageError(`${arg} needs a value`);
      return value;
    };
    if (arg === "--json") args.json = true;
    else if (arg === "--delimiter") {
      const value = next();
      // By name, as the API's delimiter query takes it (docs/glossary.md).
      if (!isDelimiterName(value)) throw new UsageError("--delimiter must be comma, semicolon or tab");
      args.delimiter = DELIMITERS[value];
    } else if (arg === "--profile") args.profile = next();
    else if (arg === "--catalogue") args.catalogue = next();
    else if (arg.startsWith("--")) throw new UsageError(`unknown option ${arg}`);
    else if (args.file === "") args.file = arg;
    else throw new UsageError(`unexpected argument ${arg}`);
  }
  if (args.file === "") throw new UsageError("no schedule file given");
  return args;
}

function readText(path: string): string {
  try {
    return readFileSync(path, "utf8");
  } catch (error) {
    throw new UsageError(`cannot read ${path}: ${(error as NodeJS.ErrnoException).code ?? "error"}`);
  }
}

function isJsonFile(path: string, text: string): boolean {
  const ext = extname(path).toLowerCase();
  if (ext === ".json") return true;
  if (ext === ".csv" || ext === ".tsv" || ext === ".txt") return false;
  return stripBom(text).trimStart().startsWith("{");
}

function parseJson(text: string, label: string): unknown {
  try {
    return JSON.parse(stripBom(text));
  } catch (error) {
    throw new UsageError(`${label}: not valid JSON (${(error as Error).message})`);
  }
}

function readCatalogue(path: string | null): CatalogueSection[] | undefined {
  if (path === null) return undefined;
  const value = parseJson(readText(path), path);
  if (!Array.isArray(value)) throw new UsageError(`${path}: a catalogue is a JSON array of {name, iMm4, areaMm2, massKgPerM}`);
  value.forEach((entry, i) => {
    const ok = typeof entry === "object" && entry !== null && typeof entry.name === "string" && [entry.iMm4, entry.areaMm2, entry.massKgPerM].every((n) => typeof n === "number" && Number.isFinite(n) && n > 0);
    if (!ok) throw new UsageError(`${path}: catalogue[${i}] needs name, and positive iMm4, areaMm2 and massKgPerM`);
  });
  return value as CatalogueSection[];
}

function formatNumber(value: number | null, digits: number): string {
  return value === null || !Number.isFinite(value) ? "-" : value.toFixed(digits);
}

/** A deflection's magnitude with its direction: "12.34 down", "0.52 up" (engine sign: + downward). */
function formatSignedDeflection(value: number, toUnit: (mm: number) => number, digits: number): string {
  const direction = getDeflectionDirection(value);
  const magnitude = formatNumber(toUnit(Math.abs(value)), digits);
  return direction === "none" ? magnitude : `${magnitude} ${direction}`;
}

/**
 * The minimum I in the schedule's own system (in^4 for US, mm^4 otherwise), rounded up so the
 * printed figure is never below the one that passes.
 */
function formatMinimumI(minIMm4: number, unitSystem: string | null): string {
  if (unitSystem === "US") {
    const converted = convertFromInternal(minIMm4, "secondMoment", "in^4");
    if (converted.ok) return `${(Math.ceil(converted.value * 10) / 10).toLocaleString("en-US", { minimumFractionDigits: 1, maximumFractionDigits: 1 })} in^4`;
  }
  return `${Math.ceil(minIMm4).toLocaleString("en-US")} mm^4`;
}

/** "l/523" for an engineer's span ratio; "-" when there is none (zero deflection). */
function formatSpanRatio(ratio: number | null | undefined): string {
  return ratio === null || ratio === undefined || !Number.isFinite(ratio) ? "-" : `l/${Math.round(ratio)}`;
}

function formatTable(outcome: Extract<CheckScheduleResult, { ok: true }>): string {
  const { schedule, results, summary } = outcome;
  const deflectionUnit = schedule.unitSystem === "US" ? "in" : "mm";
  const toUnit = (mm: number) => {
    const converted = convertFromInternal(mm, "deflection", deflectionUnit);
    return converted.ok ? converted.value : mm;
  };
  const digits = deflectionUnit === "in" ? 3 : 2;
  const header = [
    "mark",
    TERMS.governingCheck.label.toLowerCase(),
    `deflection [${deflectionUnit}]`,
    `allowed [${deflectionUnit}]`,
    TERMS.achievedRatio.label.toLowerCase(),
    TERMS.limitRatio.label.toLowerCase(),
    TERMS.utilization.label.toLowerCase(),
    TERMS.factorOfSafety.label.toLowerCase(),
    TERMS.outcome.label.toLowerCase(),
  ];
  const rows = results.map((r: MemberResult, index) => {
    const g = r.governing;
    const overall = r.governingCheck ?? null;
    const byFrequency = overall?.kind === "frequency" && r.frequency !== null;
    return [
      r.mark,
      byFrequency ? FREQUENCY_CHECK_NAME : g ? nameDeflectionCheck(g.combinationId, g.spanIndex, schedule.origins[index]?.spans) : "-",
      !byFrequency && g ? formatSignedDeflection(g.deflectionMm, toUnit, digits) : "-",
      !byFrequency && g ? formatNumber(toUnit(g.allowedMm), digits) : "-",
      byFrequency ? `${formatNumber(r.frequency!.hz, 2)} Hz` : formatSpanRatio(g?.achievedRatio),
      byFrequency ? `>= ${r.frequency!.minHz} Hz` : formatSpanRatio(g?.limitRatio),
      overall ? formatNumber(overall.utilization, 3) : "-",
      overall ? formatNumber(overall.factorOfSafety, 2) : "-",
      r.pass ? "pass" : "fail",
    ];
  });
  const widths = header.map((h, c) => Math.max(h.length, ...rows.map((row) => (row[c] ?? "").length)));
  const line = (cells: string[]) => cells.map((cell, c) => (c >= 2 && c <= 7 ? cell.padStart(widths[c] ?? 0) : cell.padEnd(widths[c] ?? 0))).join("  ").trimEnd();
  const out = [
    `${schedule.name}${schedule.reference ? ` (${schedule.reference})` : ""}`,
    `${TERMS.profile.label}: ${schedule.profile.label} - ${schedule.profile.source}`,
    "",
    line(header),
    line(widths.map((w) => "-".repeat(w))),
    ...rows.map(line),
    "",
  ];
  for (const r of results) {
    for (const note of r.notes ?? []) out.push(`${r.mark}: ${note}`);
    if (r.frequency && !r.frequency.pass) out.push(`${r.mark}: first frequency ${r.frequency.hz.toFixed(2)} Hz is below ${r.frequency.minHz} Hz`);
    if (r.suggestion) {
      const section = r.suggestion.sectionName ? `lightest passing catalogue section ${r.suggestion.sectionName}` : "";
      // a null minimum I (no I passes) is explained in the member's notes
      out.push(r.suggestion.minIMm4 === null ? `${r.mark}: no minimum I; ${section}` : `${r.mark}: needs I >= ${formatMinimumI(r.suggestion.minIMm4, schedule.unitSystem)}${section ? `; ${section}` : ""}`);
    }
    for (const note of r.notes ?? []) out.push(`${r.mark}: ${note}`);
  }
  out.push(`${summary.members} members: ${summary.passed} pass, ${summary.failed} fail.`, CAUTION);
  return `${out.join("\n")}\n`;
}

/** The results document printed by --json (api-schemas/v1/result.schema.json). */
function createResultsDocument(outcome: Extract<CheckScheduleResult, { ok: true }>): Record<string, unknown> {
  const { schedule, results, summary } = outcome;
  return {
    format: RESULTS_FORMAT,
    caution: CAUTION,
    schedule: { name: schedule.name, reference: schedule.reference, profile: { id: schedule.profile.id, label: schedule.profile.label, source: schedule.profile.source } },
    units: { length: "mm", deflection: "mm", rotation: "rad", frequency: "Hz", secondMoment: "mm^4" },
    counts: { members: summary.members, pass: summary.passed, fail: summary.failed, error: 0 },
    members: results.map((r, index) => {
      const spans = schedule.origins[index]?.spans;
      const name = (c: CheckResult) => nameDeflectionCheck(c.combinationId, c.spanIndex, spans);
      const overall = r.governingCheck ?? null;
      return {
      mark: r.mark,
      category: r.category,
      status: r.pass ? "pass" : "fail",
      governing: r.governing === null ? null : { check: name(r.governing), ...r.governing },
      governingCheck: overall === null ? null : { ...overall, key: overall.kind === "frequency" || r.governing === null ? FREQUENCY_CHECK_NAME : name(r.governing) },
      checks: r.checks.map((c) => ({ check: name(c), ...c })),
      rotations: r.rotations,
      frequency: r.frequency,
      suggestion: r.suggestion,
      ...(r.notes ? { notes: r.notes } : {}),
      };
    }),
  };
}

function formatCsvError(error: CsvRowError): string {
  const where = error.row > 0 ? `row ${error.row}${error.line !== undefined && error.line !== error.row ? ` (line ${error.line})` : ""}` : error.line !== undefined ? `line ${error.line}` : "file";
  return `${where}${error.column ? `, ${error.column}` : ""}: ${error.message}`;
}

function run(argv: string[]): { code: number; stdout: string; stderr: string } {
  const args = parseArgs(argv);
  const text = readText(args.file);
  const catalogue = readCatalogue(args.catalogue);
  let doc: unknown;
  let places: CsvRowPlace[] | null = null;
  if (isJsonFile(args.file, text)) {
    doc = parseJson(text, args.file);
    if (args.profile !== null && typeof doc === "object" && doc !== null) doc = { ...doc, profile: { preset: args.profile } };
  } else {
    if (args.profile === null) throw new UsageError(`a CSV schedule needs --profile ID; presets: ${listPresetIds().join(", ")}`);
    const csv = parseScheduleCsv(text, { delimiter: args.delimiter ?? ",", name: basename(args.file), profile: { preset: args.profile } });
    if (!csv.ok) return { code: 2, stdout: "", stderr: `${csv.errors.map(formatCsvError).join("\n")}\n` };
    doc = csv.doc;
    places = csv.places;
  }
  const outcome = checkSchedule(doc, catalogue ? { catalogue } : {});
  if (!outcome.ok) {
    const lines = outcome.issues.map((issue: InputIssue) => (places ? formatCsvError(mapIssueToCsvRow(issue, places)) : `${issue.path || "(schedule)"}: ${issue.message}`));
    return { code: 2, stdout: "", stderr: `${lines.join("\n")}\n` };
  }
  const stdout = args.json ? `${JSON.stringify(createResultsDocument(outcome), null, 2)}\n` : formatTable(outcome);
  return { code: outcome.summary.failed > 0 ? 1 : 0, stdout, stderr: "" };
}

function main(): void {
  try {
    const { code, stdout, stderr } = run(process.argv.slice(2));
    process.stdout.write(stdout);
    process.stderr.write(stderr);
    process.exitCode = code;
  } catch (error) {
    if (error instanceof UsageError) {
      process.stderr.write(`${error.message}\n${USAGE}\n`);
      process.exitCode = 2;
      return;
    }
    process.stderr.write(`internal error: ${(error as Error).message}\n`);
    process.exitCode = 3;
  }
}

main();
