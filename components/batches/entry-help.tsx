import { Field, inputClass } from "@/components/ui/field";

interface EntryHelpProps {
  initials: string;
  onInitials: (value: string) => void;
}

const KEY = "rounded border border-rule px-1 font-mono text-xs";

/** How the keyboard moves through the entry, and the initials saved with each line. */
export function EntryHelp({ initials, onInitials }: EntryHelpProps) {
  return (
    <div className="flex flex-wrap items-end justify-between gap-3 rounded border border-rule bg-panel px-3 py-2">
      <p className="max-w-2xl text-sm text-muted" id="entry-help">
        Type the actual mass and press <kbd className={KEY}>Enter</kbd> to go to the lot number; <kbd className={KEY}>Enter</kbd> again goes to the next
        line. Each line is saved as you leave it. <kbd className={KEY}>↑</kbd>/<kbd className={KEY}>↓</kbd> move between lines,{" "}
        <kbd className={KEY}>Esc</kbd> undoes a change not yet saved.
      </p>
      <Field id="batch-initials" label="Your initials" hint="saved with each line" className="w-48">
        <input
          id="batch-initials"
          className={inputClass(false, "font-mono uppercase")}
          value={initials}
          maxLength={10}
          autoComplete="off"
          onChange={(e) => onInitials(e.target.value.toUpperCase())}
        />
      </Field>
    </div>
  );
}
