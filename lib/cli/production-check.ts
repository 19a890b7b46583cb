/**
 * The checks npm run start:production runs before it starts anything: the environment is valid and
 * not the local demo's, and the database holds none of the demo's published credentials.
 * Exit codes: 0 ready, 1 refused (each reason on stderr), 3 the checks themselves failed.
 */
import { closeDb, getSql } from "@/db/client";
import { getEnv } from "@/lib/env";
import { findDemoDataProblems, findProductionConfigProblems } from "@/lib/server/operations/production-readiness";

async function main(): Promise<number> {
  const problems = findProductionConfigProblems(process.env);
  try {
    getEnv();
  } catch (error) {
    problems.push(error instanceof Error ? error.message : String(error));
    // Without a valid environment there is no database to look at.
    return report(problems);
  }
  try {
    problems.push(...(await findDemoDataProblems(getSql())));
  } catch (error) {
    console.error("production check: could not read the database:", error instanceof Error ? error.message : error);
    return 3;
  } finally {
    await closeDb();
  }
  return report(problems);
}

function report(problems: string[]): number {
  if (problems.length === 0) {
    console.error("[sagline] production checks passed");
    return 0;
  }
  console.error("[sagline] refusing to start in production:");
  for (const problem of problems) console.error(`  - ${problem}`);
  return 1;
}

process.exitCode = await main();
