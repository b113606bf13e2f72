import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { pageContext } from "@/components/layout/page-context";
import { AttachmentsPanel } from "@/components/attachments/attachments-panel";
import { MaterialForm } from "@/components/materials/material-form";
import { PageHeader } from "@/components/ui/panel";
import { getMaterial } from "@/db/queries/materials";
import { asJson } from "@/lib/client/json";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Material" };

export default async function MaterialPage({ params }: { params: Promise<{ id: string }> }) {
  const ctx = await pageContext();
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const m = await getMaterial(ctx.teamId, id);
  if (!m) notFound();
  const material = asJson(m);
  return (
    <>
      <PageHeader
        title={material.name}
        subtitle={
          <Link href="/materials" className="text-accent underline">
            Back to the library
          </Link>
        }
      />
      <MaterialForm material={material} canSave={can(ctx.role, "material:update")} canDelete={can(ctx.role, "material:delete")} />
      <AttachmentsPanel ownerType="material" ownerId={material.id} canChange={can(ctx.role, "material:update")} className="mt-4" />
    </>
  );
}
