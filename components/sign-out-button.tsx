"use client";

import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/sign-in" })}
      className="rounded-md px-3 py-1.5 text-sm font-semibold text-white/80 hover:bg-white/10 hover:text-white"
    >
      Sign out
    </button>
  );
}
