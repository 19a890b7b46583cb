// Prints the plain closing line "N passed, N failed, N skipped" from vitest's JSON report.
import { readFileSync } from "node:fs";

const report = JSON.parse(readFileSync(process.argv[2], "utf8"));
const passed = report.numPassedTests ?? 0;
// A file that fails to load has no failed test of its own: count it once.
const brokenFiles = (report.testResults ?? []).filter(
  (file) => file.status === "failed" && !(file.assertionResults ?? []).some((a) => a.status === "failed"),
).length;
const failed = (report.numFailedTests ?? 0) + brokenFiles;
const skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
if (passed === 0) {
  console.error("no test ran");
  process.exit(1);
}
