/**
 * Words for the engine's codes, shared by the screens and the spreadsheets
 * so that a recipe line's role or a thermal limit reads the same in both.
 * Framework-free; each map is typed over the engine's own union, so a new
 * code without words fails type-checking.
 */
import type { LineRole, MaterialKind } from "@/lib/formulation";

/** Words for a recipe line's role. */
export const LINE_ROLE_LABELS: Record<LineRole, string> = {
  precursor: "Precursor",
  modifier: "Modifier",
  organic: "Organic phase",
  solvent: "Solvent",
  water: "Water",
  catalyst: "Catalyst",
};

/** Words for a material's kind. */
export const KIND_LABELS: Record<MaterialKind, string> = {
  precursor: "Precursor",
  organic: "Organic phase",
  substrate: "Substrate",
  solvent: "Solvent",
  water: "Water",
  catalyst: "Catalyst",
  modifier: "Modifier",
};

/** Words for a thermal limit: the engine's own, so its messages and the screens agree. */
export { LIMIT_LABELS } from "@/lib/formulation";

/** Words for a process step's stage (input "stage"; absent = curing). */
export const STAGE_LABELS: Record<"sol" | "drying" | "curing", string> = { sol: "Sol", drying: "Drying", curing: "Curing" };

/** Words for a process step's atmosphere (input "atmosphere"; absent = air). */
export const ATMOSPHERE_LABELS: Record<"air" | "inert", string> = { air: "Air", inert: "Inert gas" };

/** Words for how a coat is applied ("none": no coat predictions). */
export const COAT_METHOD_LABELS: Record<"none" | "dip" | "spin" | "wetFilm", string> = {
  none: "Not set (no film predictions)",
  dip: "Dip coating",
  spin: "Spin coating",
  wetFilm: "Wet film of stated thickness",
};

/** Words for a batch's disposition (issue 17, lots). */
export const DISPOSITION_LABELS: Record<"released" | "rejected" | "released_under_deviation", string> = {
  released: "Released for use",
  rejected: "Rejected",
  released_under_deviation: "Released under deviation",
};

/** Words for why a lot's stock on hand was adjusted (the reasons of `LOT_ADJUSTMENT_REASONS`). */
export const ADJUSTMENT_REASON_LABELS: Record<"recount" | "damaged" | "disposed" | "sample" | "other", string> = {
  recount: "Recount",
  damaged: "Spilled or damaged",
  disposed: "Disposed of (expired or off-spec)",
  sample: "Sample sent out",
  other: "Other",
};
