import type { Material } from "@/lib/formulation";

/** A library row as the API returns it. */
export type LibraryMaterial = Material & { casNumber: string | null; updatedAt: string };
