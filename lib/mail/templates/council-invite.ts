import { renderEmail } from "../layout";

export function councilInviteEmail(p: { organisation: string; inviter: string; url: string; expires: string }) {
  return renderEmail(`Join ${p.organisation} on Duffbank`, {
    heading: `${p.inviter} invites you to ${p.organisation}'s council desk`,
    paragraphs: [
      `As council staff on Duffbank you can run giveaway days for leaves, wood chips and compost, check households in on the day, and see how much your residents kept out of the waste stream.`,
      `Open the link to accept. If you already have a Duffbank account with this e-mail address, sign in; if not, join first with this address, then come back to the link. It works until ${p.expires}.`,
      `If you did not expect this, ignore the message: nothing happens until the link is used.`,
    ],
    action: { label: "Accept the invitation", url: p.url },
  });
}
