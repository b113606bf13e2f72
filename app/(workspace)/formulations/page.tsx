import type { Metadata } from "next";
import { FormulationList } from "@/components/formulation/formulation-list";
import { pageContext } from "@/components/layout/page-context";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Formulations" };

export default async function FormulationsPage() {
  const ctx = await pageContext();
  const all = can(ctx.role, "formulation:readUnreleased");
  return (
    <>
      <PageHeader
        title="Formulations"
        subtitle={all ? "Every formulation of the team, with the state of its newest revision." : "Formulations released to production."}
        actions={
          can(ctx.role, "formulation:create") ? (
            <>
              <ButtonLink href="/import?kind=formulation">Import from a spreadsheet</ButtonLink>
              <ButtonLink href="/formulations/new" variant="primary">
                New formulation
              </ButtonLink>
            </>
          ) : null
        }
      />
      <FormulationList releasedOnly={!all} />
    </>
  );
}
