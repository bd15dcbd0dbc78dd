/**
 * The app's public base URL, for links in e-mails, calendar files and Stripe's return
 * addresses. Empty values (an untouched `APP_URL=` line from .env.example) count as unset.
 */
export function appUrl(env: NodeJS.ProcessEnv = process.env): string {
  const url = env.APP_URL || env.NEXTAUTH_URL || `http://localhost:${env.PORT || 3000}`;
  return url.replace(/\/+$/, "");
}
