// The app's public base URL, for links in e-mails and Stripe's return addresses.
export function appUrl(env: NodeJS.ProcessEnv = process.env): string {
  const url = env.APP_URL || env.NEXTAUTH_URL || `http://localhost:${env.PORT || 3000}`;
  return url.replace(/\/+$/, "");
}
