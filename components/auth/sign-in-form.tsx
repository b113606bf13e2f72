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
import { safeNextPath } from "@/lib/safe-next";
import { AuthCard, FormMessage } from "./auth-card";

const schema = z.object({
  email: z.email("Enter your e-mail address"),
  password: z.string().min(1, "Enter your password"),
});
type Values = z.infer<typeof schema>;

interface SignInFormProps {
  next: string;
  reset?: boolean;
}

/** E-mail and password sign-in. */
export function SignInForm({ next, reset = false }: SignInFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({ resolver: zodResolver(schema), defaultValues: { email: "", password: "" } });

  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    const { error: err } = await authClient.signIn.email({ email: values.email, password: values.password });
    if (err) {
      setError(authErrorMessage(err));
      return;
    }
    // Checked again here: the prop comes from the address bar through the server, and this is where the browser goes.
    router.replace(safeNextPath(next));
    router.refresh();
  });

  const { errors, isSubmitting } = formState;
  const nextQuery = next !== "/home" ? `?next=${encodeURIComponent(next)}` : "";
  return (
    <AuthCard
      title="Sign in"
      footer={
        <>
          No account yet? <Link className="text-accent underline" href={`/sign-up${nextQuery}`}>Create one</Link>.
        </>
      }
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        <FormMessage tone="info" message={reset ? "Your password has been changed. Sign in with the new one." : null} />
        <Field id="email" label="E-mail address" error={errors.email?.message}>
          <input
            id="email"
            type="email"
            autoComplete="email"
            className={inputClass(!!errors.email)}
            aria-invalid={!!errors.email}
            aria-describedby="email-error"
            {...register("email")}
          />
        </Field>
        <Field id="password" label="Password" error={errors.password?.message}>
          <input
            id="password"
            type="password"
            autoComplete="current-password"
            className={inputClass(!!errors.password)}
            aria-invalid={!!errors.password}
            aria-describedby="password-error"
            {...register("password")}
          />
        </Field>
        <FormMessage tone="error" message={error} />
        <Button type="submit" variant="primary" busy={isSubmitting}>
          {isSubmitting ? "Signing in…" : "Sign in"}
        </Button>
        <Link href="/forgot-password" className="text-sm text-accent underline">
          Forgotten your password?
        </Link>
      </form>
    </AuthCard>
  );
}
