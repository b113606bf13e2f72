"use client";

import { useState } from "react";
import { nameLinkColumn, type ServerColumn } from "@/components/ui/data-table";
import { FilterSelect, SearchBox } from "@/components/ui/list-filters";
import { StateBadge } from "@/components/ui/status";
import { ServerListTable } from "@/components/ui/server-list-table";
import { useFormulations, type FormulationRow } from "@/lib/client/formulations";
import { fmtDateTime } from "@/lib/format";
import { STATE_LABELS, type RevisionState } from "@/lib/workflow";
import { REVISION_STATES } from "@/lib/enums";

const columns: ServerColumn<FormulationRow>[] = [
  nameLinkColumn((row) => `/formulations/${row.id}`),
  { id: "project", accessorKey: "project", header: "Project", cell: ({ row }) => row.original.project ?? <span className="text-muted">none</span> },
  { id: "state", accessorKey: "latestState", header: "State", cell: ({ row }) => <StateBadge state={row.original.latestState} /> },
  {
    id: "revision",
    accessorKey: "latestRevision",
    header: "Revision",
    enableSorting: false,
    cell: ({ row }) => <span className="num">{row.original.latestRevision}</span>,
  },
  {
    id: "updatedAt",
    accessorKey: "updatedAt",
    header: "Last change",
    cell: ({ row }) => <span className="num whitespace-nowrap text-muted">{fmtDateTime(row.original.updatedAt)}</span>,
  },
];

interface FormulationListProps {
  /** Production sees released formulations only (the API filters). */
  releasedOnly?: boolean;
}

/** The team's formulations: search, filter by state, sort and page, all on the server. */
export function FormulationList({ releasedOnly = false }: FormulationListProps) {
  const [state, setState] = useState<RevisionState | "">("");
  const list = useFormulations({ state: state || undefined });

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <SearchBox label="Search by name or project" value={list.q} onChange={list.setQ} />
        {!releasedOnly ? (
          <FilterSelect
            label="State"
            value={state}
            onChange={(v) => {
              setState(v);
              list.toFirstPage();
            }}
            anyLabel="Any state"
            options={REVISION_STATES}
            words={STATE_LABELS}
            width="min-w-[12rem]"
          />
        ) : null}
      </div>
      <ServerListTable
        list={list}
        caption="Formulations"
        columns={columns}
        empty={list.q || state ? "No formulation matches." : "No formulations yet."}
      />
    </div>
  );
}

