// postgres-js 3.4.9 can throw from a queued write after its socket closed, outside any query, and
// so kill the process (upstream porsager/postgres#1154 and #1208): a worker died of it in the
// fault drill that restarts PostgreSQL during a result COPY (tests/faults/service-faults.test.ts,
// the behavioural proof). patches/postgres+3.4.9.patch, applied by patch-package on every install,
// guards the write and clears the queued write on close. This fails if an install dropped it.
import { readFileSync } from "node:fs";
import { createRequire } from "node:module";
import { dirname, join } from "node:path";

import { describe, expect, it } from "vitest";

// the package's CommonJS entry is <root>/cjs/src/index.js
const root = dirname(dirname(dirname(createRequire(import.meta.url).resolve("postgres"))));

describe("the installed PostgreSQL driver", () => {
  for (const build of ["src", "cjs/src"]) {
    it(`carries the closed-socket guard in its ${build} build`, () => {
      const source = readFileSync(join(root, build, "connection.js"), "utf8");
      const nextWrite = source.slice(source.indexOf("function nextWrite("), source.indexOf("function connectTimedOut("));
      expect(nextWrite).toContain("if (socket === null) {");
      expect(nextWrite).toContain("error(Errors.connection('CONNECTION_CLOSED', options))");
      // terminate(), closed() and nextWrite() each reset the queued write
      expect(source.match(/chunk = nextWriteTimer = null/g)).toHaveLength(4);
    });
  }
});
