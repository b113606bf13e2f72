import { buttonClass } from "@/components/ui/button";
import { materialsExportUrl, revisionExportUrl } from "@/lib/client/downloads";

export interface DownloadLink {
  href: string;
  label: string;
  /** Longer accessible name, e.g. "Download the revision as an Excel workbook (.xlsx)". */
  description?: string;
}

interface DownloadLinksProps {
  links: DownloadLink[];
  /** Words before the links, e.g. "Download". */
  title?: string;
  className?: string;
}

/** File downloads from our API as plain links (the browser keeps the session cookie). */
export function DownloadLinks({ links, title = "Download", className = "" }: DownloadLinksProps) {
  return (
    <div className={`no-print flex flex-wrap items-center gap-2 text-sm ${className}`} role="group" aria-label={title}>
      <span className="text-muted">{title}:</span>
      {links.map((l) => (
        <a key={l.href} href={l.href} download className={buttonClass("secondary", "py-1")} title={l.description}>
          <span aria-hidden="true">↓</span>
          {l.label}
        </a>
      ))}
    </div>
  );
}

/** The revision's workbook and its batch sheet as CSV. */
export function revisionDownloads(revisionId: string): DownloadLink[] {
  return [
    { href: revisionExportUrl(revisionId, "xlsx"), label: "Workbook (.xlsx)", description: "Download the revision as a workbook (.xlsx)" },
    { href: revisionExportUrl(revisionId, "csv"), label: "Batch sheet (CSV)", description: "Download the batch sheet as CSV" },
  ];
}

/** The whole materials library as a workbook and as CSV. */
export function libraryDownloads(): DownloadLink[] {
  return [
    { href: materialsExportUrl("xlsx"), label: "Workbook (.xlsx)", description: "Download the whole materials library as a workbook" },
    { href: materialsExportUrl("csv"), label: "CSV", description: "Download the whole materials library as CSV" },
  ];
}
