"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/sign-in?notice=signed-out" })}
      className="rounded border border-rule px-2 py-1 text-xs hover:bg-paper"
    >
      Sign out
    </button>
  );
}
