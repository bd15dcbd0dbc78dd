import { renderEmail } from "../layout";

// The account e-mails. Joining always sends one of the first two, so the answer on the page
// never says whether an address already has an account; the inbox does, to its owner only.

export function confirmAddressEmail(name: string, url: string) {
  return renderEmail("Confirm your e-mail address for Duffbank", {
    heading: `Welcome, ${name}`,
    paragraphs: [
      "Follow the link to confirm this address and sign in. Until then you can plan beds, but not reserve material or post a listing.",
      "The link works once, for 24 hours. If you did not join Duffbank, ignore this message and nothing happens.",
    ],
    action: { label: "Confirm and sign in", url },
  });
}

export function alreadyJoinedEmail(signInUrl: string) {
  return renderEmail("You already have a Duffbank account", {
    heading: "You already have an account",
    paragraphs: [
      "Someone (hopefully you) tried to join Duffbank with this address, but it already has an account, so nothing changed.",
      "Sign in with your password, or ask for a sign-in link by e-mail on the sign-in page if you have forgotten it.",
      "If it was not you, you can ignore this message.",
    ],
    action: { label: "Sign in", url: signInUrl },
  });
}

export function noAccountEmail(joinUrl: string) {
  return renderEmail("Your Duffbank sign-in link", {
    heading: "There is no Duffbank account for this address",
    paragraphs: ["Someone (hopefully you) asked for a sign-in link for this address, but it has no account yet.", "If it was you, join in a minute. If not, ignore this message."],
    action: { label: "Join Duffbank", url: joinUrl },
  });
}

export function passwordChangedEmail(signInUrl: string) {
  return renderEmail("Your Duffbank password was changed", {
    heading: "Your password was changed",
    paragraphs: [
      "The password of your Duffbank account was just changed, and every place you were signed in was signed out.",
      "If that was not you, ask for a sign-in link on the sign-in page now and change the password again, then tell the Duffbank team.",
    ],
    action: { label: "Sign in", url: signInUrl },
  });
}
