"use client";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import type { z } from "zod";
import { messageSchema } from "@/lib/validation/reservations";
import { formatLocal } from "@/lib/reservations/pickup-times";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { Spinner } from "@/components/ui/empty-state";
import { useReservationMessages, useSendReservationMessage } from "./use-reservation-messages";
import { Form } from "@/components/ui/form";

/** The plain-text thread between the two people on a reservation; each message is e-mailed to the other. */
export function MessageThread({ id, otherName, closed }: { id: string; otherName: string; closed: boolean }) {
  const messages = useReservationMessages(id);
  const send = useSendReservationMessage(id);
  const form = useForm<z.input<typeof messageSchema>>({ resolver: zodResolver(messageSchema), defaultValues: { body: "" } });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await send.mutateAsync(values.body);
      form.reset({ body: "" });
    } catch (err) {
      form.setError("body", { message: (err as Error).message });
    }
  });
  return (
    <div className="flex flex-col gap-3">
      {messages.isPending ? (
        <Spinner label="Loading messages" />
      ) : messages.isError ? (
        <p role="alert" className="text-sm text-ember-600">
          The messages could not be loaded. {messages.error.message}
        </p>
      ) : messages.data.length === 0 ? (
        <p className="text-sm text-humus-600">No messages yet. Ask {otherName} about timing, access or what to bring.</p>
      ) : (
        <ol className="flex flex-col gap-2" aria-label="Messages">
          {messages.data.map((m) => (
            <li key={m.id} className={`max-w-[85%] rounded-lg px-3 py-2 text-sm ${m.mine ? "self-end bg-moss-100" : "self-start bg-humus-100"}`}>
              <p className="whitespace-pre-wrap break-words">{m.body}</p>
              <p className="mt-1 text-xs text-humus-600">
                {m.mine ? "You" : m.author.name} · {formatLocal(m.created_at)}
              </p>
            </li>
          ))}
        </ol>
      )}
      {closed ? null : (
        <Form onSubmit={onSubmit} noValidate className="flex flex-col gap-1">
          <Field label={`Message to ${otherName}`} id={`message-${id}`} autoComplete="off" {...form.register("body")} error={form.formState.errors.body?.message} />
          <Button type="submit" variant="secondary" disabled={send.isPending} className="self-start">
            {send.isPending ? "Sending…" : "Send"}
          </Button>
        </Form>
      )}
    </div>
  );
}

/** The thread folded away; it loads only once someone opens it. */
export function MessagesPanel(props: { id: string; otherName: string; closed: boolean }) {
  const [opened, setOpened] = useState(false);
  return (
    <details className="rounded-lg ring-1 ring-humus-200" onToggle={(e) => e.currentTarget.open && setOpened(true)}>
      <summary className="flex min-h-11 cursor-pointer items-center px-3 font-medium">Messages with {props.otherName}</summary>
      <div className="border-t border-humus-200 p-3">{opened ? <MessageThread {...props} /> : null}</div>
    </details>
  );
}
