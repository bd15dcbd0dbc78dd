import { PageHeading } from "@/components/ui/empty-state";

export default function CheckEmail() {
  return (
    <div className="mx-auto max-w-md">
      <PageHeading title="Check your inbox" lead="We sent you a sign-in link. It works once, for 15 minutes. You can close this tab." />
    </div>
  );
}
