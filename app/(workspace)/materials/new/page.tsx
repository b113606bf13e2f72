import type { Metadata } from "next";
import { pageContext } from "@/components/layout/page-context";
import { MaterialForm } from "@/components/materials/material-form";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "New material" };

export default async function NewMaterialPage() {
  const ctx = await pageContext();
  if (!can(ctx.role, "material:create")) return <NotAllowed what="add materials to the library" />;
  return (
    <>
      <PageHeader title="New material" subtitle="Give every value its unit and its source." />
      <MaterialForm canSave canDelete={false} />
    </>
  );
}
