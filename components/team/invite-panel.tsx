"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { ROLE_LABELS, roleLabel } from "@/components/layout/role-words";
import { Button } from "@/components/ui/button";
import { ErrorPanel } from "@/components/ui/error-panel";
import { Field, inputClass } from "@/components/ui/field";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { TableSkeleton } from "@/components/ui/skeleton";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { invite, useInvitations } from "@/lib/client/team";
import { fmtDateTime } from "@/lib/format";
import { ROLE_NAMES, type RoleName } from "@/lib/permissions";

const schema = z.object({
  email: z.email("Enter an e-mail address"),
  role: z.enum(ROLE_NAMES as [RoleName, ...RoleName[]]),
});
type Values = z.infer<typeof schema>;

/** Invite someone by e-mail with a role; pending invitations below. */
export function InvitePanel() {
  const { data, error, isLoading, mutate } = useInvitations();
  const [message, setMessage] = useState<Outcome>(null);
  const { register, handleSubmit, formState, reset, setError } = useForm<Values>({
    resolver: zodResolver(schema),
    defaultValues: { email: "", role: "formulator" },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      await invite(values);
      setMessage({ tone: "info", text: `Invitation sent to ${values.email}.` });
      reset({ email: "", role: values.role });
      await mutate();
    } catch (err) {
      if (err instanceof ApiRequestError && err.fields.email) setError("email", { message: err.fields.email });
      setMessage({ tone: "error", text: `Not sent: ${errorMessage(err)}` });
    }
  });

  const pending = (data?.rows ?? []).filter((i) => i.status === "pending");
  return (
    <div className="flex flex-col gap-3">
      <form onSubmit={onSubmit} noValidate className="grid gap-3 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_auto] sm:items-end">
        <Field id="invite-email" label="E-mail address" error={errors.email?.message}>
          <input
            id="invite-email"
            type="email"
            className={inputClass(!!errors.email)}
            aria-invalid={errors.email ? true : undefined}
            aria-describedby="invite-email-error"
            {...register("email")}
          />
        </Field>
        <Field id="invite-role" label="Role" error={errors.role?.message}>
          <select id="invite-role" className={inputClass()} {...register("role")}>
            {ROLE_NAMES.map((r) => (
              <option key={r} value={r}>
                {ROLE_LABELS[r]}
              </option>
            ))}
          </select>
        </Field>
        <Button type="submit" variant="primary" busy={isSubmitting} className="sm:mb-0.5">
          Send invitation
        </Button>
      </form>
      <OutcomeMessage outcome={message} />
      <h3 className="text-xs font-semibold text-muted">Pending invitations</h3>
      {error ? (
        <ErrorPanel message={error.message} onRetry={() => mutate()} />
      ) : isLoading ? (
        <TableSkeleton rows={2} label="Loading invitations" />
      ) : pending.length === 0 ? (
        <p className="text-sm text-muted">None.</p>
      ) : (
        <ul className="divide-y divide-rule text-sm">
          {pending.map((i) => (
            <li key={i.id} className="flex flex-wrap justify-between gap-2 py-1">
              <span>
                {i.email} · {roleLabel(i.role)}
              </span>
              <span className="num text-xs text-muted">expires {fmtDateTime(i.expiresAt)}</span>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
