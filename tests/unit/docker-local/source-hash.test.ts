// The test build is reused only while its source hash is unchanged (build_web_if_needed in
// docker-local/processes.sh): the hash must move with any file the app or the workers may import,
// and stay put for tests and docs.
import { execFileSync } from "node:child_process";
import { copyFileSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

import { afterEach, describe, expect, it } from "vitest";

const dirs: string[] = [];
afterEach(() => {
  for (const dir of dirs.splice(0)) rmSync(dir, { recursive: true, force: true });
});

function makeTree(withGit: boolean): string {
  const root = mkdtempSync(join(tmpdir(), "sagline-hash-"));
  dirs.push(root);
  mkdirSync(join(root, "docker-local"));
  for (const f of ["lib.sh", "processes.sh"]) copyFileSync(join("docker-local", f), join(root, "docker-local", f));
  for (const f of ["app/page.tsx", "lib/a.ts", "workers/index.ts", "examples/x.csv", "tests/a.test.ts", "docs/a.md", "package-lock.json"]) {
    mkdirSync(join(root, f, ".."), { recursive: true });
    writeFileSync(join(root, f), "one");
  }
  if (withGit) execFileSync("git", ["init", "-q"], { cwd: root });
  return root;
}

function hashOf(root: string): string {
  return execFileSync("bash", ["-c", "source docker-local/lib.sh && source docker-local/processes.sh && source_hash"], { cwd: root, encoding: "utf8" }).trim();
}

describe.each([true, false])("source_hash (git: %s)", (withGit) => {
  it("changes with workers, lib, examples and the lockfile, not with tests or docs", () => {
    const root = makeTree(withGit);
    let previous = hashOf(root);
    expect(previous).toMatch(/^[0-9a-f]{40}$/);
    for (const f of ["workers/index.ts", "lib/a.ts", "examples/x.csv", "package-lock.json", "workers/new-job.ts"]) {
      writeFileSync(join(root, f), "two");
      const next = hashOf(root);
      expect(next, f).not.toBe(previous);
      previous = next;
    }
    for (const f of ["tests/a.test.ts", "docs/a.md", "docs/new.md"]) {
      writeFileSync(join(root, f), "two");
      expect(hashOf(root), f).toBe(previous);
    }
  });
});
