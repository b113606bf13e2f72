"use client";

import useSWR from "swr";
import { ErrorPanel } from "@/components/ui/error-panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import type { Material } from "@/lib/formulation";
import { fetcher } from "@/lib/client/fetcher";
import { FormulationEditor, type EditableRevision } from "./formulation-editor";

export const LIBRARY_KEY = "/api/materials?pageSize=500&sort=name";

interface EditorLoaderProps {
  revision?: EditableRevision;
  canSubmit: boolean;
}

/** Loads the team's library, then shows the editor. */
export function EditorLoader({ revision, canSubmit }: EditorLoaderProps) {
  const { data, error, isLoading, mutate } = useSWR<{ rows: Material[] }>(LIBRARY_KEY, fetcher);
  if (error) return <ErrorPanel title="The materials library could not be loaded" message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={8} label="Loading the materials library" />;
  return <FormulationEditor key={revision?.id ?? "new"} library={data.rows} revision={revision} canSubmit={canSubmit} />;
}
