/** Revision states, in the order a revision normally moves through them. */
export const REVISION_STATES = ["draft", "in_review", "approved", "released", "archived"] as const;
