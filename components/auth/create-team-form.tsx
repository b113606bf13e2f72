"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { z } from "zod";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { authClient } from "@/lib/auth-client";
import { ApiRequestError, errorMessage } from "@/lib/client/fetcher";
import { createTeam } from "@/lib/client/team";
import { AuthCard, FormMessage } from "./auth-card";

const schema = z.object({ name: z.string().trim().min(1, "Name your team").max(120, "At most 120 characters") });
type Values = z.infer<typeof schema>;

interface CreateTeamFormProps {
  userName: string;
}

/** First step after signing up without an invitation: the user's own team, with them as admin. */
export function CreateTeamForm({ userName }: CreateTeamFormProps) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError: setFieldError } = useForm<Values>({
    resolver: zodResolver(schema),
    defaultValues: { name: "" },
  });
  const { errors, isSubmitting } = formState;

  const onSubmit = handleSubmit(async (values) => {
    setError(null);
    try {
      await createTeam(values.name);
      router.replace("/home");
      router.refresh();
    } catch (err) {
      if (err instanceof ApiRequestError && err.fields.name) setFieldError("name", { message: err.fields.name });
      else setError(errorMessage(err));
    }
  });

  return (
    <AuthCard
      title="Create your team"
      intro={`Welcome, ${userName}. A team holds its own materials library and formulations; you will be its admin and can invite others.`}
      footer={
        <button
          type="button"
          className="text-accent underline"
          onClick={async () => {
            await authClient.signOut();
            router.replace("/sign-in");
            router.refresh();
          }}
        >
          Sign out
        </button>
      }
    >
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        <Field id="team-name" label="Team name" hint="e.g. your lab or department" error={errors.name?.message}>
          <input
            id="team-name"
            className={inputClass(!!errors.name)}
            aria-invalid={!!errors.name}
            aria-describedby="team-name-error"
            {...register("name")}
          />
        </Field>
        <FormMessage tone="error" message={error} />
        <Button type="submit" variant="primary" busy={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create team"}
        </Button>
      </form>
    </AuthCard>
  );
}
