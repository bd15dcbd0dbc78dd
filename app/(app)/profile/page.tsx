import type { Metadata } from "next";
import { pageUser } from "@/lib/auth/page-guard";
import { getAccount } from "@/lib/services/accounts/get-account";
import { ProfileForm } from "@/components/profile/profile-form";
import { AccountSecurity, ConfirmEmailNotice } from "@/components/profile/account-security";
import { PageHeading } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { ROLE_LABELS } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Profile" };

export default async function ProfilePage({ searchParams }: { searchParams: Promise<{ welcome?: string }> }) {
  const user = await pageUser("/profile");
  const row = await getAccount(user.id);
  const { welcome } = await searchParams;
  return (
    <div className="mx-auto max-w-xl">
      <PageHeading title="Your profile" lead={<>Signed in as {user.email}. Roles: {user.roles.map((r) => ROLE_LABELS[r]).join(", ") || "none"}.{user.organisation ? ` Member of ${user.organisation.name}.` : ""}</>} />
      {welcome ? (
        <div className="mb-4">
          <Notice title="Welcome to Duffbank">Your account is ready. Plan your first bed, or tick below if you have material to give.</Notice>
        </div>
      ) : null}
      {!user.email_verified ? (
        <div className="mb-4">
          <ConfirmEmailNotice email={user.email} />
        </div>
      ) : null}
      <div className="rounded-leaf bg-white p-6 ring-1 ring-humus-200">
        <ProfileForm
          initial={{ display_name: user.name, unit_system: user.unit_system, reminders_opt_out: Boolean(row?.reminders_opt_out), requested_roles: [], home: user.home }}
          roles={user.roles}
          requested={user.requested_roles}
        />
      </div>
      <div className="mt-6 rounded-leaf bg-white p-6 ring-1 ring-humus-200">
        <AccountSecurity hasPassword={Boolean(row?.password_hash)} />
      </div>
    </div>
  );
}
