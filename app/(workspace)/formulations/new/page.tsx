import type { Metadata } from "next";
import { EditorLoader } from "@/components/formulation/editor-loader";
import { pageContext } from "@/components/layout/page-context";
import { NotAllowed } from "@/components/ui/panel";
import { can } from "@/lib/permissions";

export const metadata: Metadata = { title: "New formulation" };

export default async function NewFormulationPage() {
  const ctx = await pageContext();
  if (!can(ctx.role, "formulation:create")) return <NotAllowed what="create formulations" />;
  return <EditorLoader canSubmit={false} />;
}
