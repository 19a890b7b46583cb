// Every role, and no session, against every page, cookie-session route and server action, compared
// with the one permission table. A page, route or action without an entry fails the first block.
import { readdirSync, readFileSync, statSync } from "node:fs";
import { join, relative } from "node:path";

import { beforeAll, describe, expect, it } from "vitest";

import { roles, type Role } from "@/db/schema";
import { actionAccess, pageAccess, routeAccess, type Access } from "@/lib/server/auth/access-table";
import { hasPermission } from "@/lib/server/auth/permissions";
import { anonymous, callAction, listBuiltActions, signInAs, type Agent } from "@/tests/helpers/app";

function walk(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? walk(path) : [path];
  });
}

function urlPathOf(file: string): string {
  const segments = relative("app", file).split("/").slice(0, -1).filter((s) => !/^\(.*\)$/.test(s));
  return "/" + segments.join("/");
}

const files = walk("app");
const pageFiles = files.filter((f) => /\/page\.tsx$/.test(f));
const routeFiles = files.filter((f) => /\/route\.ts$/.test(f) && !f.startsWith("app/api/v1/"));

function routeKeysOf(file: string): string[] {
  const source = readFileSync(file, "utf8");
  const methods = [...source.matchAll(/export\s+(?:const|async function|function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]);
  return methods.map((m) => `${m} ${urlPathOf(file)}`);
}

type Who = Role | "anonymous";
type Outcome = "allow" | "unauthenticated" | "forbidden";

function expected(access: Access, who: Who): Outcome {
  if (access === "public") return "allow";
  if (who === "anonymous") return "unauthenticated";
  if (access === "signed-in") return "allow";
  return hasPermission(who, access) ? "allow" : "forbidden";
}

function concrete(path: string, method = "GET"): string {
  return path.replace(/\[\.\.\.nextauth\]/, method === "GET" ? "session" : "_log").replace(/\[[^\]]+\]/g, "x".repeat(43));
}

describe("the permission table covers everything that exists", () => {
  it("has an entry for every page", () => {
    const found = pageFiles.map(urlPathOf).sort();
    expect(found).toEqual(Object.keys(pageAccess).sort());
  });

  it("has an entry for every cookie-session route handler", () => {
    const found = routeFiles.flatMap(routeKeysOf).sort();
    expect(found).toEqual(Object.keys(routeAccess).sort());
  });

  it("has an entry for every server action in the build", () => {
    const found = listBuiltActions().map((a) => a.key).sort();
    expect(found).toEqual(Object.keys(actionAccess).sort());
  });
});

describe("every role against every page, route and action", () => {
  const agents = new Map<Who, Agent>();
  const everyone: Who[] = ["anonymous", ...roles];

  beforeAll(async () => {
    agents.set("anonymous", anonymous());
    for (const role of roles) agents.set(role, await signInAs(role));
  });

  for (const who of everyone) {
    it(`pages as ${who}`, async () => {
      const agent = agents.get(who)!;
      for (const [path, access] of Object.entries(pageAccess)) {
        const response = await agent.get(concrete(path)).redirects(0);
        const want = expected(access, who);
        const label = `${who} GET ${path}`;
        if (want === "unauthenticated") {
          expect(response.status, label).toBe(307);
          expect(response.headers.location, label).toMatch(/\/sign-in\?callbackUrl=/);
        } else if (want === "forbidden") {
          expect(response.status, label).toBe(403);
        } else if (path === "/") {
          expect(response.status, label).toBeLessThan(400);
        } else {
          // A page with an id segment answers 404 for the made-up id once access is granted.
          expect(/\[[^\]]+\]/.test(path) ? [200, 404] : [200], label).toContain(response.status);
        }
      }
    });

    it(`routes as ${who}`, async () => {
      const agent = agents.get(who)!;
      for (const [key, access] of Object.entries(routeAccess)) {
        const [method, path] = key.split(" ") as [string, string];
        const url = concrete(path, method);
        const response = method === "GET" ? await agent.get(url).redirects(0) : await agent.post(url).set("Origin", process.env.APP_URL!).redirects(0);
        const want = expected(access, who);
        const label = `${who} ${key}`;
        if (want === "allow") {
          expect([401, 403], label).not.toContain(response.status);
          expect(response.status, label).toBeLessThan(500);
        } else {
          expect(response.status, label).toBe(want === "unauthenticated" ? 401 : 403);
          expect(response.headers["content-type"], label).toContain("application/problem+json");
        }
      }
    });

    it(`server actions as ${who}`, async () => {
      const agent = agents.get(who)!;
      for (const action of listBuiltActions()) {
        const access = actionAccess[action.key as keyof typeof actionAccess];
        const { status, result } = await callAction(agent, action, {});
        const want = expected(access, who);
        const label = `${who} ${action.key}`;
        expect(status, label).toBe(200);
        // Allowed callers get as far as input validation; the empty input is always invalid.
        expect(result?.code, label).toBe(want === "allow" ? "invalid_input" : want);
      }
    });
  }
});

describe("cross-site writes", () => {
  it("refuses a server action with a foreign, null or missing Origin, without a 500", async () => {
    const agent = await signInAs("admin");
    const action = listBuiltActions().find((a) => a.key === "people/inviteMember")!;
    for (const origin of ["http://evil.example", "null", null]) {
      const response = await callAction(agent, action, { email: "x@example.com", role: "viewer" }, origin);
      expect(response.status, String(origin)).toBe(403);
      expect(response.body).toContain("bad-origin");
    }
  });

  it("refuses a sign-in POST from another site", async () => {
    const response = await anonymous().post("/api/auth/callback/credentials").set("Origin", "http://evil.example").type("form").send({ email: "a@b.c", password: "x" });
    expect(response.status).toBe(403);
    expect(response.body).toMatchObject({ type: "https://sagline.dev/problems/bad-origin", status: 403 });
  });
});
