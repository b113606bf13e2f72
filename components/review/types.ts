import type { FormulationInput, FormulationResult } from "@/lib/formulation";
import type { RevisionState } from "@/lib/workflow";

/** A revision as GET /api/revisions/:id returns it. */
export interface RevisionDto {
  id: string;
  formulationId: string;
  number: number;
  state: RevisionState;
  input: FormulationInput;
  result: FormulationResult | null;
  computeError: string | null;
  version: number;
  authorId: string | null;
  /** Everyone who created, saved or submitted it (filled while it waits for review). */
  authorIds?: string[];
  authorName: string | null;
  formulationName: string;
  project: string | null;
  engineVersion: string;
  createdAt: string;
  updatedAt: string;
  submittedAt: string | null;
  approvedAt: string | null;
  releasedAt: string | null;
  reviews: { id: string; decision: "approved" | "returned"; comment: string | null; reviewerName: string | null; createdAt: string }[];
}

/** What the viewer may do, worked out on the server. */
export interface Abilities {
  userId: string;
  update: boolean;
  submit: boolean;
  review: boolean;
  release: boolean;
  archive: boolean;
  readUnreleased: boolean;
}
