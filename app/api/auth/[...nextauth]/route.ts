import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { authOptions } from "@/lib/auth/options";
import { limitAuthRequest } from "@/lib/auth/auth-limits";

const handler = NextAuth(authOptions);

// Sign-in attempts and link requests past their limits get a 429 before next-auth runs.
async function POST(req: NextRequest, ctx: { params: Promise<{ nextauth: string[] }> }): Promise<Response> {
  return (await limitAuthRequest(req)) ?? handler(req, ctx);
}

export { handler as GET, POST };
