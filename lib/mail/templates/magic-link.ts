import { renderEmail } from "../layout";

export function magicLinkEmail(url: string) {
  return renderEmail("Your Duffbank sign-in link", {
    heading: "Sign in to Duffbank",
    paragraphs: [
      "Someone (hopefully you) asked for a sign-in link. It works once and for 15 minutes.",
      "If you did not ask for it, you can ignore this message.",
    ],
    action: { label: "Sign in", url },
  });
}
