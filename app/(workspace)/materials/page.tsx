import type { Metadata } from "next";
import { pageContext } from "@/components/layout/page-context";
import { DownloadLinks, libraryDownloads } from "@/components/exports/download-links";
import { MaterialsTable } from "@/components/materials/materials-table";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Materials" };

export default async function MaterialsPage() {
  const ctx = await pageContext();
  return (
    <>
      <PageHeader
        title="Materials"
        subtitle="The team's library: precursors, organic phases, substrates, solvents, water and catalysts, with sources for every value."
        actions={
          can(ctx.role, "material:create") ? (
            <>
              <ButtonLink href="/import?kind=materials">Import from a spreadsheet</ButtonLink>
              <ButtonLink href="/materials/new" variant="primary">
                New material
              </ButtonLink>
            </>
          ) : null
        }
      />
      <DownloadLinks
        className="mb-3"
        title="Download the library"
        links={libraryDownloads()}
      />
      <MaterialsTable />
    </>
  );
}
