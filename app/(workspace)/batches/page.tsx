import type { Metadata } from "next";
import Link from "next/link";
import { pageContext } from "@/components/layout/page-context";
import { BatchList } from "@/components/batches/batch-list";
import { BATCH_STATE_LABELS } from "@/components/batches/batch-words";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { NotAllowed, PageHeader } from "@/components/ui/panel";
import { getFormulation } from "@/db/queries/formulations";
import { BATCH_STATES, type BatchState } from "@/lib/enums";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "Batch records" };

export default async function BatchesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const ctx = await pageContext();
  if (!can(ctx.role, "batch:read")) return <NotAllowed what="see batch records" />;
  const params = await searchParams;
  const formulationId = typeof params.formulationId === "string" && /^[0-9a-f-]{36}$/i.test(params.formulationId) ? params.formulationId : undefined;
  const state = BATCH_STATES.find((s): s is BatchState => s === params.state);
  const formulation = formulationId
    ? await getFormulation(ctx.teamId, formulationId, { releasedOnly: !can(ctx.role, "formulation:readUnreleased") })
    : null;
  return (
    <>
      <PageHeader
        title={formulation ? `Batch records of ${formulation.name}` : "Batch records"}
        subtitle={
          formulation ? (
            <Link href="/batches" className="text-accent underline">
              All batch records
            </Link>
          ) : (
            "Every batch weighed against a released revision, newest first. Start a new one from its batch sheet."
          )
        }
      />
      <form className="mb-3 flex flex-wrap items-end gap-2" aria-label="Filter batch records">
        {formulationId ? <input type="hidden" name="formulationId" value={formulationId} /> : null}
        <label className="flex flex-col gap-1 text-[13px] font-medium">
          State
          <select name="state" defaultValue={state ?? ""} className={inputClass(false, "w-48")}>
            <option value="">Open and closed</option>
            {BATCH_STATES.map((s) => (
              <option key={s} value={s}>
                {BATCH_STATE_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <Button type="submit">Show</Button>
      </form>
      <BatchList
        formulationId={formulation?.id}
        state={state}
        canRecord={can(ctx.role, "batch:update")}
        empty={formulation ? "No batch of this formulation has been recorded yet." : "No batch records yet."}
      />
    </>
  );
}
