import type { Metadata } from "next";
import { ImportWizard } from "@/components/imports/import-wizard";
import { pageContext } from "@/components/layout/page-context";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { IMPORT_KINDS, type ImportKind } from "@/lib/enums";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Import from a spreadsheet" };

export default async function ImportPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await pageContext();
  const kinds: ImportKind[] = [];
  if (can(ctx.role, "formulation:create")) kinds.push("formulation");
  if (can(ctx.role, "material:create")) kinds.push("materials");
  if (kinds.length === 0) return <NotAllowed what="import formulations or materials" />;
  const params = await searchParams;
  const asked = IMPORT_KINDS.find((k) => k === params.kind && kinds.includes(k));
  const initialKind = asked ?? kinds[0]!;
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
