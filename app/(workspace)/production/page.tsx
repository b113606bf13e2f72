import type { Metadata } from "next";
import { Suspense } from "react";
import { pageContext } from "@/components/layout/page-context";
import { ReleasedList } from "@/components/production/released-list";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Batch sheets" };

export default async function ProductionPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:read")) return <NotAllowed what="see batch sheets" />;
  const params = await searchParams;
  const q = typeof params.q === "string" ? params.q.trim().slice(0, 200) : "";
  return (
    <>
      <PageHeader title="Batch sheets" subtitle="Formulations released to production. Open one to print its batch sheet." />
      <form role="search" className="mb-3 flex max-w-md items-end gap-2">
        <label className="flex flex-1 flex-col gap-1 text-[13px] font-medium">
          Search released formulations
          <input type="search" name="q" defaultValue={q} className={inputClass()} />
        </label>
        <Button type="submit">Search</Button>
      </form>
      <Suspense key={q} fallback={<TableSkeleton rows={4} label="Loading released formulations" />}>
        <ReleasedList teamId={ctx.teamId} q={q || undefined} />
      </Suspense>
    </>
  );
}
