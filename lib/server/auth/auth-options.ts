import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";

import { getEnv } from "@/lib/env";

import { readClientAddress } from "./client-address";
import { PASSWORD_MAX_LENGTH } from "./passwords";
import { toSameOriginPath } from "./safe-callback";
import { signInWithPassword } from "./sign-in";

export const SIGN_IN_ERROR_INVALID = "invalid";

// The token carries only the user id and when it was issued; role and organization are read
// from PostgreSQL on every request so that a role change or a removal applies immediately.
export function getAuthOptions(): NextAuthOptions {
  return {
    secret: getEnv().NEXTAUTH_SECRET,
    session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "E-mail and password",
        credentials: { email: { type: "email" }, password: { type: "password" } },
        async authorize(credentials, request) {
          const email = String(credentials?.email ?? "");
          const password = String(credentials?.password ?? "");
          if (!email || !password || email.length > 320 || password.length > PASSWORD_MAX_LENGTH) {
            throw new Error(SIGN_IN_ERROR_INVALID);
          }
          const headers = new Headers(Object.entries(request?.headers ?? {}).map(([k, v]) => [k, String(v)] as [string, string]));
          const outcome = await signInWithPassword(email, password, readClientAddress(headers, getEnv().TRUSTED_PROXY_COUNT));
          // The error code is the sign-in page's message key: "invalid", "locked" or "throttled".
          if (!outcome.ok) throw new Error(outcome.reason);
          return { id: outcome.userId, sessionVersion: outcome.sessionVersion };
        },
      }),
    ],
    callbacks: {
      // Every redirect next-auth makes stays on this app (see toSameOriginPath for the corpus).
      redirect({ url, baseUrl }) {
        return `${new URL(baseUrl).origin}${toSameOriginPath(url, baseUrl)}`;
      },
      jwt({ token, user }) {
        if (user) {
          token.uid = user.id;
          token.sv = (user as { sessionVersion?: number }).sessionVersion ?? 0;
        }
        return token;
      },
      session({ session, token }) {
        return { ...session, uid: token.uid, sessionVersion: token.sv } as typeof session;
      },
    },
  };
}
