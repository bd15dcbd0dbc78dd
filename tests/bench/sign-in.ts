// A demo account's session cookie, through next-auth's own credentials sign-in, for the
// benchmarks that load signed-in pages (tests/bench/lighthouse.ts, tests/bench/pages.ts).

/** The session cookie of `email`, signed in with its password as the sign-in page would. */
export async function signIn(base: string, email: string, password: string): Promise<string> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const i = pair.indexOf("=");
      jar.set(pair.slice(0, i), pair.slice(i + 1));
    }
  };
  const cookie = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie(), origin: base },
    body: new URLSearchParams({ email, password, csrfToken, json: "true" }),
  });
  keep(res);
  if (![...jar.keys()].some((k) => k.includes("session-token"))) throw new Error(`signing in as ${email} gave no session (${res.status})`);
  return cookie();
}

