import { PageHeading } from "@/components/ui/empty-state";

export default function CheckEmail() {
  return (
    <div className="mx-auto max-w-md">
      <PageHeading title="Check your inbox" lead="If that address has a Duffbank account, a sign-in link is on its way; it works once, for 15 minutes. If it has none, the e-mail says how to join. You can close this tab." />
    </div>
  );
}
