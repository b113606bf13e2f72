/**
 * A formulation revision as an .xlsx workbook (overview with the coat
 * predictions, batch sheet, coating and VOC, dry composite, thermal check and
 * the full input for re-import) and its batch sheet as CSV.
 */
import { ATMOSPHERE_LABELS, LIMIT_LABELS, LINE_ROLE_LABELS, STAGE_LABELS } from "@/lib/labels";
import { DEFAULT_BALANCE_RESOLUTION_G, VOLUME_RESOLUTION_ML } from "@/lib/batches";
import { hardLimit, type FormulationInput, type FormulationResult, type Material } from "@/lib/formulation";
import { batchCoatRows, coatCells, coatPredictionRows } from "./coat-rows";
import { inputSheets } from "./input-sheets";
import { SHEET, readMeRows } from "./template";
import type { Cell } from "./types";
import { buildWorkbook, toCsv, type SheetSpec } from "./write";

/** What the export needs to know about a revision (as getRevision returns it). */
export interface RevisionForExport {
  formulationName: string;
  project: string | null;
  description?: string | null;
  number: number;
  state: string;
  input: FormulationInput;
  result: FormulationResult | null;
  computeError: string | null;
  authorName: string | null;
  engineVersion: string;
  approvedAt: Date | string | null;
  releasedAt: Date | string | null;
  reviews: { decision: string; reviewerName: string | null; createdAt: Date | string; comment: string | null }[];
}

const SAFETY_CODES = new Set(["alkoxide_handling", "methanol_released", "toxic_by_inhalation", "corrosive"]);
function iso(value: Date | string | null | undefined): string | null {
  if (!value) return null;
  const date = typeof value === "string" ? new Date(value) : value;
  return Number.isNaN(date.getTime()) ? null : date.toISOString().replace("T", " ").slice(0, 16) + " UTC";
}

function basisText(input: FormulationInput): string {
  const b = input.basis;
  if (b.type === "solidMass") return `dry solid mass ${b.grams} g`;
  if (b.type === "solidsContent") return `sol mass ${b.solMassGrams} g at solids content ${b.solidsFraction}`;
  return `gel body: mould volume ${b.volumeMl} mL, bulk density ${b.bulkDensity} g/cm³, linear shrinkage ${b.linearShrinkage ?? 0}`;
}

function materialNames(input: FormulationInput): Map<string, Material> {
  return new Map(input.materials.map((m) => [m.id, m]));
}

/** How the batch sheet shows its figures. */
export interface BatchSheetOptions {
  /** The balance's readability, g (the team's batch settings); masses are shown to it. Default 0.01 g. */
  balanceResolutionGrams?: number;
  /** The team's currency code, written beside each cost (default: "team's currency"). */
  currency?: string;
}

/** The Coating and VOC table of the batch sheet (Item / Value / Unit); null when the revision has neither. */
export function coatAndVocTable(revision: RevisionForExport): { header: Cell[][]; rows: Cell[][]; rowSteps: (number | undefined)[] } | null {
  const rows = batchCoatRows(revision.input, revision.result);
  if (rows.length === 0) return null;
  return { header: [["Setting", "Value", "Unit"]], ...coatCells(rows) };
}

/**
 * Batch sheet rows: order of addition, material, role, lot number (blank),
 * target mass and volume as supplied, blank columns to fill in. `steps`: the
 * target mass is shown to the balance resolution, the volume to 0.01 mL.
 */
export function batchSheetTable(
  revision: RevisionForExport,
  options: BatchSheetOptions = {},
): { header: Cell[][]; rows: Cell[][]; steps: (number | undefined)[] } {
  const grams = options.balanceResolutionGrams ?? DEFAULT_BALANCE_RESOLUTION_G;
  const byId = materialNames(revision.input);
  const columns: Cell[] = [
    "Order",
    "Material",
    "Role",
    "Lot number",
    "Target mass as supplied (g)",
    "Target volume as supplied (mL)",
    "Actual mass (g)",
    "Time (hh:mm)",
    "Initials",
  ];
  const lines = (revision.result?.lines ?? []).filter((line) => line.massGrams > 0);
  return {
    header: [columns],
    steps: [undefined, undefined, undefined, undefined, grams, VOLUME_RESOLUTION_ML, grams],
    rows: lines.map((line, index) => [
      index + 1,
      byId.get(line.materialId)?.name ?? line.materialId,
      LINE_ROLE_LABELS[line.role].toLowerCase(),
      null,
      line.massGrams,
      line.volumeMl,
      null,
      null,
      null,
    ]),
  };
}

function overviewRows(revision: RevisionForExport, currency?: string): { rows: Cell[][]; rowSteps: (number | undefined)[] } {
  const result = revision.result;
  const rows: Cell[][] = [
    ["Formulation", revision.formulationName, ""],
    ["Project", revision.project ?? "", ""],
    ["Revision", revision.number, ""],
    ["State", revision.state.replace("_", " "), ""],
    ["Author", revision.authorName ?? "", ""],
    ["Approved", iso(revision.approvedAt) ?? "not approved", ""],
    ["Released to production", iso(revision.releasedAt) ?? "not released", ""],
    ["Basis", basisText(revision.input), ""],
    ["Engine version", revision.engineVersion, ""],
  ];
  for (const review of revision.reviews) {
    rows.push([
      review.decision === "approved" ? "Approval" : "Returned",
      `${review.reviewerName ?? "unknown reviewer"}, ${iso(review.createdAt) ?? ""}${review.comment ? `: ${review.comment}` : ""}`,
      "",
    ]);
  }
  if (!result) {
    rows.push(["Cannot be computed", revision.computeError ?? "no result", ""]);
    return { rows, rowSteps: [] };
  }
  rows.push(
    ["Sol mass", result.sol.massGrams, "g"],
    ["Sol volume (ideal mixing)", result.sol.volumeMl, "mL"],
    ["Solids content", result.sol.solidsFraction, "mass fraction"],
    ["Dry composite mass", result.composite.massGrams, "g"],
    ["Water: effective R", result.water.effectiveR, "mol H2O per mol network atom"],
    ["Water: effective h", result.water.effectiveH ?? null, "mol H2O per mol hydrolysable group (none: no alkoxy groups)"],
  );
  const names = materialNames(revision.input);
  const nameOf = (id: string) => names.get(id)?.name ?? id;
  for (const m of result.modifiers ?? []) {
    rows.push([`Modifier: ${nameOf(m.materialId)} on ${nameOf(m.precursorId)}`, m.molPerMetal, "mol per mol metal"]);
  }
  if (result.solvent) {
    rows.push(
      [`Solvent: ${nameOf(result.solvent.materialId)} added`, result.solvent.addedGrams, "g"],
      [`Solvent: ${nameOf(result.solvent.materialId)} carried by other materials`, result.solvent.carriedGrams, "g"],
    );
  }
  const coat = coatCells(coatPredictionRows(revision.input, result, currency));
  const rowSteps: (number | undefined)[] = [...rows.map(() => undefined), ...coat.rowSteps];
  rows.push(...coat.rows, ["Thermal check", result.thermal.status, ""]);
  const safety = result.notices.filter((n) => SAFETY_CODES.has(n.code));
  const other = result.notices.filter((n) => !SAFETY_CODES.has(n.code));
  for (const notice of other) rows.push([`Notice (${notice.level})`, notice.message, ""]);
  for (const notice of safety) rows.push(["Safety caution", notice.message, ""]);
  rows.push([
    "Safety",
    "Follow the supplier's safety data sheet for each material, local regulations and licensed practice. This sheet does not replace them.",
    "",
  ]);
  return { rows, rowSteps };
}

function compositeRows(revision: RevisionForExport): Cell[][] {
  const result = revision.result;
  if (!result) return [["Cannot be computed", revision.computeError ?? "", null, null, null]];
  const byId = materialNames(revision.input);
  const c = result.composite;
  const rows: Cell[][] = c.phases.map((phase) => [
    byId.get(phase.materialId)?.name ?? phase.materialId,
    phase.residueFormula ?? "organic phase",
    phase.weightFraction,
    phase.volumeFraction,
    phase.density,
  ]);
  rows.push(
    [null, null, null, null, null],
    ["Dry composite mass (g)", null, c.massGrams, null, null],
    ["Theoretical density (g/cm³)", null, c.theoreticalDensity, null, null],
    ["Porosity (fraction)", null, c.porosity ?? null, null, null],
    ["Shrinkage, sol to dense solid, volumetric (fraction)", null, c.denseShrinkage.volumetric, null, null],
    ["Shrinkage, sol to dense solid, linear (fraction)", null, c.denseShrinkage.linear, null, null],
  );
  if (c.dryGelShrinkage) {
    rows.push(
      ["Shrinkage, sol to dry gel, volumetric (fraction)", null, c.dryGelShrinkage.volumetric, null, null],
      ["Shrinkage, sol to dry gel, linear (fraction)", null, c.dryGelShrinkage.linear, null, null],
    );
  }
  rows.push([
    "Figures are ideal: complete hydrolysis and condensation, all solvent, water, alcohol and catalyst removed.",
    null,
    null,
    null,
    null,
  ]);
  return rows;
}

/** A step's column heading: name, stage, gas, temperature and time (a step stored without stage or gas is a cure in air). */
export function stepHeading(step: FormulationInput["steps"][number]): string {
  return `${step.name} (${STAGE_LABELS[step.stage ?? "curing"].toLowerCase()}, ${ATMOSPHERE_LABELS[step.atmosphere ?? "air"].toLowerCase()}, ${step.temperatureC} °C, ${step.durationH} h)`;
}

function thermalSheet(revision: RevisionForExport): SheetSpec {
  const steps = revision.input.steps;
  const header: Cell[] = [
    "Material",
    "Hard limit in air (°C)",
    "Glass transition (°C)",
    "Melting point (°C)",
    ...steps.map(stepHeading),
  ];
  const result = revision.result;
  if (!result) return { name: SHEET.thermal, header: [header], rows: [["Cannot be computed", revision.computeError ?? ""]] };
  const byId = materialNames(revision.input);
  const materialIds: string[] = [];
  for (const check of result.thermal.checks) if (!materialIds.includes(check.materialId)) materialIds.push(check.materialId);
  const rows: Cell[][] = materialIds.map((id) => {
    const material = byId.get(id);
    const hard = material?.thermal
      ? hardLimit({
          materialId: id,
          name: material.name,
          role: id === revision.input.substrateId ? "substrate" : "organic",
          thermal: material.thermal,
          path: "materials",
        })
      : undefined;
    return [
      material?.name ?? id,
      hard?.limitC ?? null,
      material?.thermal?.glassTransitionC ?? null,
      material?.thermal?.meltingC ?? null,
      ...steps.map((step) => {
        const check = result.thermal.checks.find((c) => c.materialId === id && c.stepName === step.name);
        if (!check) return null;
        return check.status === "clear" ? "clear" : `${check.status}: ${LIMIT_LABELS[check.limit]} ${check.limitC} °C`;
      }),
    ];
  });
  rows.push([null], ["Overall", result.thermal.status]);
  if (result.thermal.maxAllowedC !== undefined) {
    const binding = result.thermal.binding;
    rows.push(
      ["Highest allowed step temperature (°C)", result.thermal.maxAllowedC],
      [
        "Bound by",
        binding ? `${byId.get(binding.materialId)?.name ?? binding.materialId}, ${LIMIT_LABELS[binding.limit]}` : "",
      ],
    );
  }
  return { name: SHEET.thermal, header: [header], rows, widths: [34, 12, 12, 12, ...steps.map(() => 30)] };
}

/** Every sheet of a revision's workbook. */
export function revisionSheets(revision: RevisionForExport, options: BatchSheetOptions = {}): SheetSpec[] {
  const batch = batchSheetTable(revision, options);
  const overview = overviewRows(revision, options.currency);
  const coat = coatAndVocTable(revision);
  return [
    { name: SHEET.overview, header: [["Item", "Value", "Unit"]], rows: overview.rows, rowSteps: overview.rowSteps, widths: [30, 90, 32] },
    { name: SHEET.batchSheet, header: batch.header, rows: batch.rows, steps: batch.steps, widths: [7, 34, 14, 16, 16, 16, 14, 12, 10] },
    ...(coat ? [{ name: SHEET.coatAndVoc, header: coat.header, rows: coat.rows, rowSteps: coat.rowSteps, widths: [40, 16, 60] }] : []),
    {
      name: SHEET.composite,
      header: [["Phase", "Residue formula", "Weight fraction (mass fraction)", "Volume fraction (fraction)", "Density (g/cm³)"]],
      rows: compositeRows(revision),
      widths: [48, 16, 18, 18, 14],
    },
    thermalSheet(revision),
    ...inputSheets(revision.input, { name: revision.formulationName, project: revision.project, description: revision.description }),
    { name: SHEET.readMe, header: [], rows: readMeRows("formulation"), widths: [36, 120] },
  ];
}

/**
 * The revision's workbook, as bytes. Batch-sheet masses keep their exact
 * value, with a number format that shows the balance resolution.
 *
 * @example
 * ```ts
 * const bytes = revisionWorkbook(await getRevision(teamId, id), await getBatchSettings(teamId));
 * ```
 */
export function revisionWorkbook(revision: RevisionForExport, options: BatchSheetOptions = {}): Buffer {
  return buildWorkbook(revisionSheets(revision, options));
}

/**
 * The batch sheet as CSV, masses rounded to the balance resolution and
 * volumes to 0.01 mL; then, when the revision has a coating or a VOC
 * figure, the "[Coating and VOC]" table (settings to three significant
 * figures, with units).
 */
export function batchSheetCsv(revision: RevisionForExport, options: BatchSheetOptions = {}): string {
  const batch = batchSheetTable(revision, options);
  const coat = coatAndVocTable(revision);
  return toCsv([
    { name: SHEET.batchSheet, rows: [...batch.header, ...batch.rows], steps: batch.steps },
    ...(coat ? [{ name: SHEET.coatAndVoc, rows: [...coat.header, ...coat.rows], rowSteps: [...coat.header.map(() => undefined), ...coat.rowSteps] }] : []),
  ]);
}

/** A file name without characters that trouble file systems or headers. */
export function safeFileName(base: string, extension: string): string {
  const cleaned = base.normalize("NFKD").replace(/[^\w.-]+/g, "-").replace(/-+/g, "-").replace(/^-|-$/g, "").slice(0, 80);
  return `${cleaned || "export"}.${extension}`;
}
