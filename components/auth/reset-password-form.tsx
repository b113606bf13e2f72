"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { authClient, authErrorMessage } from "@/lib/auth-client";
import { AuthCard, FormMessage } from "./auth-card";

const schema = z
  .object({
    password: z.string().min(10, "At least 10 characters").max(128, "At most 128 characters"),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });
type Values = z.infer<typeof schema>;

interface ResetPasswordFormProps {
  token: string | null;
  linkError: string | null;
}

/** Sets a new password with the token from the e-mailed link. */
export function ResetPasswordForm({ token, linkError }: ResetPasswordFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { password: "", confirm: "" } });
  const { errors, isSubmitting } = formState;

  if (!token || linkError) {
    return (
      <AuthCard title="This link does not work">
        <p className="text-sm">The link has expired or was already used. Ask for a new one.</p>
        <Link className="mt-3 inline-block text-accent underline" href="/forgot-password">
          Ask for a new link
        </Link>
      </AuthCard>
    );
  }

  const onSubmit = handleSubmit(async ({ password }) => {
    setError(null);
    const { error: err } = await authClient.resetPassword({ newPassword: password, token });
    if (err) setError(authErrorMessage(err));
    else router.replace("/sign-in?reset=done");
  });

  return (
    <AuthCard title="Choose a new password">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        <Field id="new-password" label="New password" hint="at least 10 characters" error={errors.password?.message}>
          <input
            id="new-password"
            type="password"
            autoComplete="new-password"
            className={inputClass(!!errors.password)}
            aria-invalid={!!errors.password}
            aria-describedby="new-password-error"
            {...register("password")}
          />
        </Field>
        <Field id="new-password-again" label="New password again" error={errors.confirm?.message}>
          <input
            id="new-password-again"
            type="password"
            autoComplete="new-password"
            className={inputClass(!!errors.confirm)}
            aria-invalid={!!errors.confirm}
            aria-describedby="new-password-again-error"
            {...register("confirm")}
          />
        </Field>
        <FormMessage tone="error" message={error} />
        <Button type="submit" variant="primary" busy={isSubmitting}>
          Set the new password
        </Button>
      </form>
    </AuthCard>
  );
}
