import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";

import { getEnv } from "@/lib/env";

import { PASSWORD_MAX_LENGTH } from "./passwords";
import { signInWithPassword } from "./sign-in";

export const SIGN_IN_ERROR_INVALID = "invalid";
export const SIGN_IN_ERROR_LOCKED = "locked";

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
        async authorize(credentials) {
          const email = String(credentials?.email ?? "");
          const password = String(credentials?.password ?? "");
          if (!email || !password || email.length > 320 || password.length > PASSWORD_MAX_LENGTH) {
            throw new Error(SIGN_IN_ERROR_INVALID);
          }
          const outcome = await signInWithPassword(email, password);
          if (!outcome.ok) throw new Error(outcome.reason === "locked" ? SIGN_IN_ERROR_LOCKED : SIGN_IN_ERROR_INVALID);
          return { id: outcome.userId, sessionVersion: outcome.sessionVersion };
        },
      }),
    ],
    callbacks: {
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
