import type { Notice } from "@/lib/formulation";
import { SAFETY_REMINDER } from "@/components/ui/hazards";

const LEVEL: Record<Notice["level"], { word: string; style: string; mark: string }> = {
  error: { word: "Error", style: "border-fail/50 bg-fail-soft", mark: "✕" },
  caution: { word: "Caution", style: "border-caution/50 bg-caution-soft", mark: "!" },
  info: { word: "Note", style: "border-rule bg-paper", mark: "i" },
};
const ORDER: Record<Notice["level"], number> = { error: 0, caution: 1, info: 2 };
const TEXT: Record<Notice["level"], string> = { error: "text-fail", caution: "text-caution", info: "text-muted" };

interface NoticesListProps {
  notices: Notice[];
}

/** The engine's notices, errors first, each with its level in words. */
export function NoticesList({ notices }: NoticesListProps) {
  const sorted = [...notices].sort((a, b) => ORDER[a.level] - ORDER[b.level]);
  const safety = notices.some((n) => /safety data sheet/i.test(n.message));
  return (
    <div className="flex flex-col gap-1.5">
      <ul className="flex flex-col gap-1.5" data-testid="notices">
        {sorted.map((n, i) => (
          <li key={`${n.code}-${i}`} data-code={n.code} className={`rounded border px-2.5 py-1.5 text-sm ${LEVEL[n.level].style}`}>
            <span className={`mr-1.5 font-semibold ${TEXT[n.level]}`}>
              <span aria-hidden="true">{LEVEL[n.level].mark} </span>
              {LEVEL[n.level].word}:
            </span>
            {n.message}
          </li>
        ))}
      </ul>
      {safety ? null : <p className="text-xs text-muted">{SAFETY_REMINDER}</p>}
    </div>
  );
}
