import Link from "next/link";
import type { RefObject } from "react";
import { Alert } from "@/components/ui/alert";
import { plural } from "@/components/ui/plural";
import type { SavedImport } from "./use-import-wizard";

interface ImportSavedProps {
  saved: SavedImport;
  /** The heading, focused when the outcome appears. */
  headingRef: RefObject<HTMLHeadingElement | null>;
}

/** What a confirmed import saved, with links to the new formulation, its revision and the materials added. */
export function ImportSaved({ saved, headingRef }: ImportSavedProps) {
  const { preview, formulationId, revisionId } = saved;
  const created = preview.materials.filter((m) => m.action === "create");
  const linked = preview.materials.length - created.length;
  return (
    <Alert tone="clear" role="status" data-testid="import-saved">
      <h2 ref={headingRef} tabIndex={-1} className="font-semibold text-clear">
        <span aria-hidden="true">✓ </span>Saved from {preview.fileName}
      </h2>
      {formulationId ? (
        <p className="mt-1">
          New formulation “{preview.kind === "formulation" ? preview.formulation.name : ""}” with a draft revision.{" "}
          <Link href={`/formulations/${formulationId}`} className="font-medium text-accent underline">
            Open the formulation
          </Link>
          {revisionId ? (
            <>
              {" · "}
              <Link href={`/revisions/${revisionId}`} className="font-medium text-accent underline">
                Open revision 1
              </Link>
            </>
          ) : null}
        </p>
      ) : null}
      <p className="mt-1">
        {plural(created.length, "material")} added to the library
        {created.length ? ": " : "."}
        {created.map((m, i) => (
          <span key={m.id}>
            {i > 0 ? ", " : ""}
            <Link href={`/materials/${m.id}`} className="text-accent underline">
              {m.name}
            </Link>
          </span>
        ))}
        {linked ? ` ${linked} linked to the library.` : ""}
      </p>
    </Alert>
  );
}
