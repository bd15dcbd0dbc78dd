/** The app's public base URL, for links in e-mails and calendar files. */
export function appUrl(): string {
  return (process.env.APP_URL ?? process.env.NEXTAUTH_URL ?? `http://localhost:${process.env.PORT ?? 3000}`).replace(/\/$/, "");
}
