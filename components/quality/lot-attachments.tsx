"use client";

import { AttachmentsPanel } from "@/components/attachments/attachments-panel";

/** The certificate of analysis (and other PDFs) of a lot. */
export function LotAttachments({ lotId, canChange }: { lotId: string; canChange: boolean }) {
  return <AttachmentsPanel ownerType="lot" ownerId={lotId} canChange={canChange} defaultKind="coa" />;
}
