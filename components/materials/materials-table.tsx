"use client";

import { useState } from "react";
import { KIND_LABELS } from "@/components/results/words";
import { nameLinkColumn, type ServerColumn } from "@/components/ui/data-table";
import { HazardCodes, SAFETY_REMINDER } from "@/components/ui/hazards";
import { FilterSelect, SearchBox } from "@/components/ui/list-filters";
import { ServerListTable } from "@/components/ui/server-list-table";
import { MATERIAL_KINDS, type MaterialKind } from "@/lib/formulation/kinds";
import { fmtDate, fmtDensity, fmtPercent, fmtQuantity, fmtTemp } from "@/lib/format";
import { useMaterials, type LibraryMaterial } from "@/lib/client/materials";

function keyProperty(m: LibraryMaterial): string {
  if (m.kind === "precursor" && m.precursor) {
    const yieldFraction = m.molarMass ? (m.precursor.residuePerMolecule * m.precursor.residueMolarMass) / m.molarMass : undefined;
    return `→ ${m.precursor.residueFormula}${yieldFraction ? `, yield ${fmtPercent(yieldFraction)}` : ""}`;
  }
  if ((m.kind === "organic" || m.kind === "substrate") && m.thermal) {
    const t = m.thermal;
    return [
      t.glassTransitionC !== undefined ? `Tg ${fmtTemp(t.glassTransitionC)}` : "",
      t.meltingC !== undefined ? `Tm ${fmtTemp(t.meltingC)}` : "",
      t.degradationOnsetC !== undefined ? `Td ${fmtTemp(t.degradationOnsetC)}` : "",
      t.heatDeflectionC !== undefined ? `HDT ${fmtTemp(t.heatDeflectionC)}` : "",
      t.maxServiceC !== undefined ? `max ${fmtTemp(t.maxServiceC)}` : "",
    ]
      .filter(Boolean)
      .join(" · ");
  }
  if (m.kind === "modifier" && m.modifier) {
    return `replaces ${m.modifier.groupsReplacedPerMolecule} alkoxy group(s), bonded as ${m.modifier.bondedFormula}`;
  }
  if (m.assay !== undefined && m.assay < 1) return `assay ${fmtPercent(m.assay)}`;
  return "";
}

const columns: ServerColumn<LibraryMaterial>[] = [
  nameLinkColumn((row) => `/materials/${row.id}`),
  { id: "kind", accessorKey: "kind", header: "Kind", cell: ({ row }) => KIND_LABELS[row.original.kind] },
  { id: "formula", accessorKey: "formula", header: "Formula", enableSorting: false, cell: ({ row }) => <span className="font-mono text-xs">{row.original.formula ?? "–"}</span> },
  {
    id: "molarMass",
    accessorKey: "molarMass",
    header: "Molar mass",
    enableSorting: false,
    cell: ({ row }) => <span className="num whitespace-nowrap">{fmtQuantity(row.original.molarMass, "g/mol", 5)}</span>,
  },
  {
    id: "density",
    accessorKey: "density",
    header: "Density",
    enableSorting: false,
    cell: ({ row }) => <span className="num whitespace-nowrap">{fmtDensity(row.original.density)}</span>,
  },
  { id: "key", header: "Key properties", enableSorting: false, cell: ({ row }) => <span className="num text-xs">{keyProperty(row.original)}</span> },
  { id: "hazards", header: "GHS hazard statements", enableSorting: false, cell: ({ row }) => <HazardCodes codes={row.original.hazards} /> },
  { id: "casNumber", accessorKey: "casNumber", header: "CAS", enableSorting: false, cell: ({ row }) => <span className="num">{row.original.casNumber ?? "–"}</span> },
  {
    id: "updatedAt",
    accessorKey: "updatedAt",
    header: "Last change",
    cell: ({ row }) => <span className="num whitespace-nowrap text-muted">{fmtDate(row.original.updatedAt)}</span>,
  },
];

/** The team's materials library: search, filter by kind, sort, page and choose columns (all done by the API). */
export function MaterialsTable() {
  const [kind, setKind] = useState<MaterialKind | "">("");
  const list = useMaterials({ kind: kind || undefined });
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <SearchBox label="Search by name or CAS number" value={list.q} onChange={list.setQ} />
        <FilterSelect
          label="Kind"
          value={kind}
          onChange={(v) => {
            setKind(v);
            list.toFirstPage();
          }}
          anyLabel="Any kind"
          options={MATERIAL_KINDS}
          words={KIND_LABELS}
        />
      </div>
      <ServerListTable
        list={list}
        caption="Materials library"
        columns={columns}
        initialVisibility={{ casNumber: false, updatedAt: false }}
        empty={list.q || kind ? "No material matches." : "The library is empty."}
      />
      <p className="text-xs text-muted">⚠ GHS hazard statements as recorded in the library. {SAFETY_REMINDER}</p>
    </div>
  );
}
