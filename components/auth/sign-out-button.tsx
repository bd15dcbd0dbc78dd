"use client";
import { signOut } from "next-auth/react";

export function SignOutButton() {
  return (
    <button type="button" onClick={() => signOut({ callbackUrl: "/" })} className="block min-h-11 rounded-lg px-3 py-2 font-medium text-humus-800 hover:bg-humus-100">
      Sign out
    </button>
  );
}
