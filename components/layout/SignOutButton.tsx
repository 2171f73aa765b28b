"use client";

import { signOut } from "next-auth/react";

export function SignOutButton({ className = "" }: { className?: string }) {
  return (
    <button
      type="button"
      onClick={() => signOut({ callbackUrl: "/signin" })}
      className={`rounded border border-soil-200 px-3 py-1.5 text-sm hover:bg-soil-100 ${className}`}
    >
      Sign out
    </button>
  );
}
