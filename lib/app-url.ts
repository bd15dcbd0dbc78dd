/**
 * The app's public base URL, for links in e-mails, calendar files and Stripe's return
 * addresses. Empty values (an untouched `APP_URL=` line from .env.example) count as unset.
 */
export { appUrl } from "./env";
