"use client";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { inviteSchema } from "@/lib/validation/council";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { useApiAction } from "@/components/ui/use-api-action";
import { Form } from "@/components/ui/form";
import { formatLocal } from "@/lib/reservations/pickup-times";

type InviteValues = z.infer<typeof inviteSchema>;

interface Member {
  id: string;
  name: string;
  email: string;
  org_role: string;
}
interface Invite {
  id: string;
  email: string;
  expires_at: string;
}

/** The council's staff: everyone sees the list; the account owner invites and removes. */
export function StaffPanel({ members, invites, isOwner, me }: { members: Member[]; invites: Invite[]; isOwner: boolean; me: string }) {
  const action = useApiAction();
  const form = useForm<InviteValues>({ resolver: zodResolver(inviteSchema), defaultValues: { email: "" } });
  const onInvite = form.handleSubmit(async (values) => {
    const done = await action.run("/api/council/invites", { body: values, onFields: (f) => f.email && form.setError("email", { message: f.email }) });
    if (done) form.reset({ email: "" });
  });
  return (
    <div className="flex flex-col gap-4">
      {action.error ? <Notice tone="error">{action.error}</Notice> : null}
      <ul className="divide-y divide-humus-100">
        {members.map((m) => (
          <li key={m.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
            <span>
              {m.name} <span className="text-sm text-humus-600">{m.email}</span>
            </span>
            <span className="flex items-center gap-3">
              <span className="text-sm text-humus-700">{m.org_role === "owner" ? "Account owner" : "Staff"}</span>
              {isOwner && m.org_role !== "owner" && m.id !== me ? (
                <Button
                  variant="secondary"
                  disabled={action.busy}
                  onClick={() => {
                    if (window.confirm(`Remove ${m.name} from your council's staff? They lose access to the council desk at once.`)) {
                      void action.run(`/api/council/members/${m.id}`, { method: "DELETE" });
                    }
                  }}
                >
                  Remove<span className="sr-only"> {m.name}</span>
                </Button>
              ) : null}
            </span>
          </li>
        ))}
      </ul>
      {invites.length ? (
        <div>
          <h3 className="font-medium">Invited, not yet joined</h3>
          <ul className="divide-y divide-humus-100">
            {invites.map((i) => (
              <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
                <span>
                  {i.email} <span className="text-sm text-humus-600">link works until {formatLocal(i.expires_at)}</span>
                </span>
                {isOwner ? (
                  <Button variant="quiet" disabled={action.busy} onClick={() => action.run(`/api/council/invites/${i.id}`, { method: "DELETE" })}>
                    Withdraw<span className="sr-only"> the invitation to {i.email}</span>
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {isOwner ? (
        <Form onSubmit={onInvite} noValidate className="flex flex-col gap-2 sm:flex-row sm:items-start" aria-label="Invite a colleague">
          <div className="flex-1">
            <Field label="Invite a colleague by e-mail" type="email" autoComplete="off" {...form.register("email")} error={form.formState.errors.email?.message} />
          </div>
          <Button type="submit" className="sm:mt-7" disabled={action.busy}>
            {action.busy ? "Sending…" : "Send invitation"}
          </Button>
        </Form>
      ) : (
        <p className="text-sm text-humus-600">Only your council&apos;s account owner can invite or remove staff.</p>
      )}
    </div>
  );
}
