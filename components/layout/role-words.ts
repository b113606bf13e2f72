import type { RoleName } from "@/lib/permissions";

/** Plain words for each role. */
export const ROLE_LABELS: Record<RoleName, string> = {
  admin: "Admin",
  formulator: "Formulator",
  reviewer: "Reviewer",
  production: "Production",
};

export const ROLE_DESCRIPTIONS: Record<RoleName, string> = {
  admin: "manages members, roles and the materials library",
  formulator: "keeps materials up to date, designs formulations, submits them for review",
  reviewer: "checks thermal compatibility and chemistry, approves or sends back",
  production: "sees released formulations and batch sheets only",
};

/** The words for a role as the API sends it (a role we do not know reads as itself). */
export function roleLabel(role: string | null): string {
  if (!role) return "no role";
  return (ROLE_LABELS as Record<string, string>)[role] ?? role;
}
