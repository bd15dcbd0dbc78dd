// Where to send someone after signing in, joining or following a link: only a path on this
// site. Everything else — another host, a protocol-relative "//host", the backslash forms
// browsers read as slashes ("/\host", "\\host"), the same percent-encoded (once or more), a
// scheme ("javascript:", "https:"), control characters browsers drop — goes home instead.

const HOME = "/";
const PROBE = "http://duffbank.invalid";

function unsafeForm(value: string): boolean {
  if (!value.startsWith("/")) return true;
  if (value.startsWith("//") || value.startsWith("/\\")) return true;
  // Browsers drop tabs and newlines from URLs and read "\" as "/", so "/\t/host" is "//host".
  if (/[\\\u0000-\u001f\u007f]/.test(value)) return true;
  try {
    return new URL(value, PROBE).origin !== PROBE;
  } catch {
    return true;
  }
}

/** `raw` when it is a path on this site in every decoding of it, else "/". */
export function safeCallbackPath(raw: unknown): string {
  if (typeof raw !== "string") return HOME;
  const value = raw.trim();
  if (!value || value.length > 2048) return HOME;
  let form = value;
  for (let i = 0; i < 4; i++) {
    if (unsafeForm(form)) return HOME;
    let decoded: string;
    try {
      decoded = decodeURIComponent(form);
    } catch {
      return HOME;
    }
    if (decoded === form) return value;
    form = decoded;
  }
  // Still decoding after four rounds: nobody links like that on purpose.
  return HOME;
}

/** Where a signed-in person lands: what is waiting for them (app/(app)/home). */
export const SIGNED_IN_HOME = "/home";

/**
 * Where signing in leads: the page they came from, or — when they came from the public home
 * page or from nowhere in particular — the page of what is waiting for them.
 */
export function afterSignInPath(raw: unknown): string {
  const path = safeCallbackPath(raw);
  return path === HOME ? SIGNED_IN_HOME : path;
}
