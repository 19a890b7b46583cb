// Prints the plain closing line "N passed, N failed, N skipped" from vitest's JSON report.
import { readFileSync } from "node:fs";

const report = JSON.parse(readFileSync(process.argv[2], "utf8"));
const passed = report.numPassedTests ?? 0;
const failed = (report.numFailedTests ?? 0) + (report.numFailedTestSuites ?? 0);
const skipped = (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
if (passed === 0) {
  console.error("no test ran");
  process.exit(1);
}
