interface SkeletonProps {
  className?: string;
}

/** A grey placeholder block while data loads. */
function Skeleton({ className = "h-4 w-full" }: SkeletonProps) {
  return <div aria-hidden="true" className={`animate-pulse rounded bg-rule/60 ${className}`} />;
}

interface TableSkeletonProps {
  rows?: number;
  label?: string;
}

/** Rows of placeholders, announced once as "Loading …". */
export function TableSkeleton({ rows = 5, label = "Loading" }: TableSkeletonProps) {
  return (
    <div role="status" aria-live="polite" className="flex flex-col gap-2 py-2">
      <span className="sr-only">{label}…</span>
      {Array.from({ length: rows }, (_, i) => (
        <Skeleton key={i} className="h-6 w-full" />
      ))}
    </div>
  );
}
