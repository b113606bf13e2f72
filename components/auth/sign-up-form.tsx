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

const schema = z
  .object({
    name: z.string().trim().min(1, "Enter your name").max(120, "At most 120 characters"),
    email: z.email("Enter an e-mail address"),
    password: z.string().min(10, "At least 10 characters").max(128, "At most 128 characters"),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], message: "The two passwords differ" });
type Values = z.infer<typeof schema>;

interface SignUpFormProps {
  /** An invitation page to return to after the account exists. */
  next: string | null;
}

/** Creates an account; then the user creates a team or accepts an invitation. */
export function SignUpForm({ next }: SignUpFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState } = useForm<Values>({
    resolver: zodResolver(schema),
    defaultValues: { name: "", email: "", password: "", confirm: "" },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    const { error: err } = await authClient.signUp.email({ name: values.name, email: values.email, password: values.password });
    if (err) {
      setError(authErrorMessage(err));
      return;
    }
    router.replace(safeNextPath(next, "/create-team"));
    router.refresh();
  });

  const field = (name: keyof Values, label: string, type: string, autoComplete: string, hint?: string) => (
    <Field id={`signup-${name}`} label={label} hint={hint} error={errors[name]?.message}>
      <input
        id={`signup-${name}`}
        type={type}
        autoComplete={autoComplete}
        className={inputClass(!!errors[name])}
        aria-invalid={!!errors[name]}
        aria-describedby={`signup-${name}-error`}
        {...register(name)}
      />
    </Field>
  );

  return (
    <AuthCard
      title="Create an account"
      intro={next ? "Then accept the invitation you received." : "Then create your team, or ask a team admin to invite you."}
      footer={
        <>
          Already have an account?{" "}
          <Link className="text-accent underline" href={next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in"}>
            Sign in
          </Link>
          .
        </>
      }
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        {field("name", "Your name", "text", "name")}
        {field("email", "E-mail address", "email", "email")}
        {field("password", "Password", "password", "new-password", "at least 10 characters")}
        {field("confirm", "Password again", "password", "new-password")}
        <FormMessage tone="error" message={error} />
        <Button type="submit" variant="primary" busy={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create account"}
        </Button>
      </form>
    </AuthCard>
  );
}
