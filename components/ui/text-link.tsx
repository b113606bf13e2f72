import Link from "next/link";
import type { ComponentProps } from "react";

/** Class of a link inside running text: accent colour, a quiet underline that darkens on hover. */
export const TEXT_LINK = "text-accent underline underline-offset-2 decoration-rule hover:decoration-accent";

/**
 * A link inside running text or a table cell.
 *
 * @example
 * ```tsx
 * <TextLink href={`/revisions/${id}`}>Open revision 2</TextLink>
 * ```
 */
export function TextLink({ className = "", ...props }: ComponentProps<typeof Link>) {
  return <Link {...props} className={`${TEXT_LINK} ${className}`} />;
}
