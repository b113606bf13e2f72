import type { LineRole } from "@/lib/formulation";

/** A line's deviation from target, as the server works it out. */
export interface LineDeviationDto {
  absoluteGrams: number;
  relative: number | null;
  toleranceGrams: number;
  outside: boolean;
}

/** One weighed line of a batch record. */
export interface BatchLineDto {
  index: number;
  materialId: string;
  name?: string;
  role?: LineRole;
  targetGrams?: number;
  targetMl?: number;
  actualGrams: number | null;
  lotNumber: string | null;
  at?: string;
  initials?: string;
  deviation: LineDeviationDto | null;
}

/** A batch record as GET /api/batches/:id returns it. */
export interface BatchDto {
  id: string;
  state: "open" | "closed";
  formulationId: string;
  formulationName: string;
  revisionId: string;
  revisionNumber: number;
  toleranceFraction: number;
  balanceResolutionGrams: number;
  notes: string | null;
  startedByName: string | null;
  closedByName: string | null;
  createdAt: string;
  updatedAt: string;
  closedAt: string | null;
  lines: BatchLineDto[];
  summary: { lines: number; weighed: number; outside: number };
  composition: {
    components: { materialId: string; name: string; targetWeightFraction: number; actualWeightFraction: number }[];
    solidGrams: { target: number; actual: number };
    effectiveR: { target: number; actual: number };
    effectiveH: { target: number; actual: number };
  } | null;
}

/** A row of GET /api/batches. */
export interface BatchListRow {
  id: string;
  state: "open" | "closed";
  revisionId: string;
  revisionNumber: number;
  formulationId: string;
  formulationName: string;
  toleranceFraction: number;
  balanceResolutionGrams: number;
  startedByName: string | null;
  createdAt: string;
  closedAt: string | null;
  lineCount: number;
  weighed: number;
  outside: number;
}
