import { readFileSync } from "node:fs";
import { join } from "node:path";

import request from "supertest";

import { demoUsers } from "@/db/seed-data";
import type { Role } from "@/db/schema";

import { nextTestAddress } from "./test-address";

/** The server npm test started; tests talk to it over real HTTP. */
export const APP_URL = process.env.APP_URL ?? "http://127.0.0.1:3793";
export const MAIL_UI_URL = process.env.MAIL_UI_URL ?? "http://127.0.0.1:3794/";

export type Agent = ReturnType<typeof request.agent>;

export function anonymous(): Agent {
  return request.agent(APP_URL);
}

/** Signs in through next-auth's credentials endpoint exactly as the sign-in form does. */
export async function signIn(email: string, password: string): Promise<{ agent: Agent; error: string | null; status: number }> {
  const agent = request.agent(APP_URL);
  const csrf = await agent.get("/api/auth/csrf");
  const response = await agent
    .post("/api/auth/callback/credentials")
    .set("Origin", APP_URL)
    // Each sign-in from an address of its own: the per-address throttle is tested on its own.
    .set("X-Forwarded-For", nextTestAddress())
    .type("form")
    .send({ csrfToken: csrf.body.csrfToken, email, password, json: "true" });
  const url = typeof response.body?.url === "string" ? new URL(response.body.url) : null;
  return { agent, error: url?.searchParams.get("error") ?? null, status: response.status };
}

export function demoUser(role: Role) {
  const user = demoUsers.find((u) => u.role === role);
  if (!user) throw new Error(`no demo user for ${role}`);
  return user;
}

export async function signInAs(role: Role): Promise<Agent> {
  const { email, password } = demoUser(role);
  const result = await signIn(email, password);
  if (result.error) throw new Error(`demo ${role} could not sign in: ${result.error}`);
  return result.agent;
}

interface ManifestEntry {
  filename: string;
  exportedName: string;
  workers: Record<string, unknown>;
}

/** Server actions as the build registered them: id, file, export and a page that serves them. */
export function listBuiltActions() {
  const dist = process.env.SAGLINE_DIST_DIR ?? ".next";
  const manifest = JSON.parse(readFileSync(join(dist, "server", "server-reference-manifest.json"), "utf8")) as {
    node: Record<string, ManifestEntry>;
  };
  return Object.entries(manifest.node).map(([id, entry]) => {
    const folder = entry.filename.split("/").slice(-2, -1)[0] ?? "";
    const worker = Object.keys(entry.workers)[0] ?? "";
    const pagePath = "/" + worker.replace(/^app\//, "").replace(/\/page$/, "").split("/").filter((s) => !/^\(.*\)$/.test(s)).map((s) => (s.startsWith("[") ? "x".repeat(43) : s)).join("/");
    return { id, key: `${folder}/${entry.exportedName}`, pagePath: pagePath.replace(/\/$/, "") || "/" };
  });
}

/** Calls a server action over HTTP as the browser's fetch does, returning its result object. */
export async function callAction(agent: Agent, action: { id: string; pagePath: string }, input: Record<string, unknown>, origin: string | null = APP_URL) {
  let req = agent
    .post(action.pagePath)
    .set("Next-Action", action.id)
    .set("Accept", "text/x-component")
    .set("Content-Type", "text/plain;charset=UTF-8");
  if (origin !== null) req = req.set("Origin", origin);
  const response = await req.send(JSON.stringify([null, input]));
  const text = response.text ?? "";
  const line = text.split("\n").find((l) => l.startsWith("1:"));
  let result: { ok: boolean; code?: string; message?: string; fieldErrors?: Record<string, string> } | null = null;
  try {
    result = line ? JSON.parse(line.slice(2)) : null;
  } catch {
    result = null;
  }
  return { status: response.status, result, redirect: response.headers["x-action-redirect"] as string | undefined, body: text };
}

export function findAction(key: string) {
  const action = listBuiltActions().find((a) => a.key === key);
  if (!action) throw new Error(`action ${key} is not in the build`);
  return action;
}
