import request from "supertest";

import { APP_URL } from "./app";

export { nextTestAddress } from "./test-address";

export interface SignInAnswer {
  status: number;
  /** The error code of next-auth's answer ("invalid", "locked", "throttled"), or null on success. */
  error: string | null;
  /** Where next-auth sends the browser next. */
  url: string | null;
  body: unknown;
  contentType: string | undefined;
  cookieNames: string[];
}

/**
 * Signs in through next-auth's credentials endpoint as the form does, from a chosen client
 * address (X-Forwarded-For; the test server trusts no proxy, so the header is the address).
 */
export async function signInFrom(input: { email: string; password: string; forwardedFor: string; callbackUrl?: string }): Promise<SignInAnswer> {
  const agent = request.agent(APP_URL);
  const csrf = await agent.get("/api/auth/csrf");
  const form: Record<string, string> = { csrfToken: csrf.body.csrfToken, email: input.email, password: input.password, json: "true" };
  if (input.callbackUrl !== undefined) form.callbackUrl = input.callbackUrl;
  const response = await agent.post("/api/auth/callback/credentials").set("Origin", APP_URL).set("X-Forwarded-For", input.forwardedFor).type("form").send(form);
  const url = typeof response.body?.url === "string" ? response.body.url : null;
  const setCookies = ([] as string[]).concat(response.headers["set-cookie"] ?? []);
  return {
    status: response.status,
    error: url ? new URL(url).searchParams.get("error") : null,
    url,
    body: response.body,
    contentType: response.headers["content-type"],
    cookieNames: setCookies.map((c) => c.split("=")[0]!).sort(),
  };
}
