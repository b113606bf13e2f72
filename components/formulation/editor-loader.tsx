"use client";

import { ErrorPanel } from "@/components/ui/error-panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { useLibrary } from "@/lib/client/materials";
import { FormulationEditor, type EditableRevision } from "./formulation-editor";

interface EditorLoaderProps {
  revision?: EditableRevision;
  canSubmit: boolean;
}

/** Loads the team's library, then shows the editor. */
export function EditorLoader({ revision, canSubmit }: EditorLoaderProps) {
  const { data, error, isLoading, mutate } = useLibrary();
  if (error) return <ErrorPanel title="The materials library could not be loaded" message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={8} label="Loading the materials library" />;
  return <FormulationEditor key={revision?.id ?? "new"} library={data.rows} revision={revision} canSubmit={canSubmit} />;
}
