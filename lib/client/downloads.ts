/**
 * Where files download from: plain links the browser follows with its
 * session cookie. No hooks here, so server pages can build the links too.
 */

/** A revision's workbook (.xlsx) or its batch sheet as CSV. */
export function revisionExportUrl(revisionId: string, format: "xlsx" | "csv"): string {
  return `/api/revisions/${revisionId}/export?format=${format}`;
}

/** The whole materials library as a workbook or CSV. */
export function materialsExportUrl(format: "xlsx" | "csv"): string {
  return `/api/materials/export?format=${format}`;
}

/** A document kept with a material or batch record (a short-lived signed link behind a redirect). */
export function attachmentDownloadUrl(id: string): string {
  return `/api/attachments/${id}?download=1`;
}

/** A saved exploration's points, computed again from its revision, as a workbook or CSV (one row per point). */
export function explorationExportUrl(explorationId: string, format: "xlsx" | "csv"): string {
  return `/api/explorations/${explorationId}/export?format=${format}`;
}

/** The design explorer for a revision, or opening a saved exploration in it. */
export function explorerUrl(formulationId: string, opts: { revisionId?: string; explorationId?: string } = {}): string {
  const params = new URLSearchParams();
  if (opts.revisionId) params.set("revision", opts.revisionId);
  if (opts.explorationId) params.set("exploration", opts.explorationId);
  const q = params.toString();
  return `/formulations/${formulationId}/explore${q ? `?${q}` : ""}`;
}
