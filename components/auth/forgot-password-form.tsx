"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { authClient, authErrorMessage } from "@/lib/auth-client";
import { AuthCard, FormMessage } from "./auth-card";

const schema = z.object({ email: z.email("Enter your e-mail address") });
type Values = z.infer<typeof schema>;

/** Asks for a password-reset link by e-mail. */
export function ForgotPasswordForm() {
  const [sent, setSent] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { email: "" } });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async ({ email }) => {
    setError(null);
    const { error: err } = await authClient.requestPasswordReset({ email, redirectTo: "/reset-password" });
    if (err) setError(authErrorMessage(err));
    else setSent(true);
  });

  return (
    <AuthCard
      title="Forgotten password"
      intro="We send a link to choose a new password. It works for one hour."
      footer={
        <Link className="text-accent underline" href="/sign-in">
          Back to sign in
        </Link>
      }
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        <Field id="reset-email" label="E-mail address" error={errors.email?.message}>
          <input
            id="reset-email"
            type="email"
            autoComplete="email"
            className={inputClass(!!errors.email)}
            aria-invalid={!!errors.email}
            aria-describedby="reset-email-error"
            {...register("email")}
          />
        </Field>
        <FormMessage
          tone="info"
          message={sent ? "If an account uses this address, a link is on its way. Check your mail (and the spam folder)." : null}
        />
        <FormMessage tone="error" message={error} />
        <Button type="submit" variant="primary" busy={isSubmitting}>
          Send the link
        </Button>
      </form>
    </AuthCard>
  );
}
