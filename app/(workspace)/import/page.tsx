import type { Metadata } from "next";
import { ImportWizard, type ImportKind } from "@/components/imports/import-wizard";
import { pageContext } from "@/components/layout/page-context";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Import from a spreadsheet" };

export default async function ImportPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await pageContext();
  const kinds: ImportKind[] = [];
  if (can(ctx.role, "formulation:create")) kinds.push("formulation");
  if (can(ctx.role, "material:create")) kinds.push("materials");
  if (kinds.length === 0) return <NotAllowed what="import formulations or materials" />;
  const params = await searchParams;
  const asked = params.kind === "materials" || params.kind === "formulation" ? params.kind : undefined;
  const initialKind = asked && kinds.includes(asked) ? asked : kinds[0]!;
  return (
    <>
      <PageHeader
        title="Import from a spreadsheet"
        subtitle="Upload a workbook or CSV file in our template. Every cell is checked first; nothing is saved until you have read the preview and confirmed it."
      />
      <ImportWizard kinds={kinds} initialKind={initialKind} />
    </>
  );
}
