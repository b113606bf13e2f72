/**
 * Round trip: a revision exported to .xlsx (and its input as sectioned CSV)
 * and imported again gives an identical FormulationInput, for every demo
 * formulation and for generated ones. Source of the expected values: the
 * input itself (identity), no arithmetic involved.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeFormulation, type FormulationInput, type Material } from "@/lib/formulation";
import { STEP_ATMOSPHERES, STEP_STAGES, WATER_RATIOS } from "@/lib/formulation/input-schema";
import { demoInputs } from "@/lib/spreadsheet/example";
import { revisionWorkbook, type RevisionForExport } from "@/lib/spreadsheet/export-formulation";
import { inputSheets } from "@/lib/spreadsheet/input-sheets";
import { previewFormulationImport } from "@/lib/spreadsheet/import-formulation";
import type { LibraryEntry } from "@/lib/spreadsheet/import-materials";
import { readUpload } from "@/lib/spreadsheet/read";
import { FORMULATION_INPUT_SHEETS, SHEET } from "@/lib/spreadsheet/template";
import { toCsv } from "@/lib/spreadsheet/write";

function asRevision(name: string, input: FormulationInput): RevisionForExport {
  let result = null;
  let computeError = null;
  try {
    result = computeFormulation(input);
  } catch (err) {
    computeError = (err as Error).message;
  }
  return {
    formulationName: name,
    project: "Round trip",
    number: 1,
    state: "released",
    input,
    result,
    computeError,
    authorName: "Flora Formulator",
    engineVersion: "test",
    approvedAt: null,
    releasedAt: null,
    reviews: [],
  };
}

/** The library holds the input's own materials, so every material links back to its id. */
function libraryOf(input: FormulationInput): LibraryEntry[] {
  return input.materials.map((m) => ({ id: m.id, name: m.name, casNumber: m.casNumber ?? null, material: m }));
}

function noNewIds(): string {
  throw new Error("no material should be created in a round trip");
}

async function roundTripXlsx(name: string, input: FormulationInput) {
  const bytes = revisionWorkbook(asRevision(name, input));
  const parsed = await readUpload(bytes, "export.xlsx", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
  return previewFormulationImport(parsed.sheets, libraryOf(input), new Set(), noNewIds);
}

async function roundTripCsv(name: string, input: FormulationInput) {
  const sheets = inputSheets(input, { name });
  const text = toCsv(sheets.map((s) => ({ name: s.name, rows: [...s.header, ...s.rows] })));
  const parsed = await readUpload(Buffer.from(text, "utf8"), "export.csv", { wanted: FORMULATION_INPUT_SHEETS, defaultSheet: SHEET.input });
  return previewFormulationImport(parsed.sheets, libraryOf(input), new Set(), noNewIds);
}

/** JSON identity: what is stored in the revision's JSON column. */
const stored = (input: FormulationInput) => JSON.parse(JSON.stringify(input)) as unknown;

describe("spreadsheet round trip", () => {
  it.each(demoInputs().map((d) => [`${d.name} r${d.revision}`, d.input] as const))(
    "returns the same FormulationInput for the demo formulation %s (xlsx and csv)",
    async (name, input) => {
      const viaXlsx = await roundTripXlsx(name, input);
      expect(viaXlsx.problems.filter((p) => p.level === "error")).toEqual([]);
      expect(stored(viaXlsx.input!)).toEqual(stored(input));
      expect(viaXlsx.formulation.name).toBe(name);
      const viaCsv = await roundTripCsv(name, input);
      expect(viaCsv.problems.filter((p) => p.level === "error")).toEqual([]);
      expect(stored(viaCsv.input!)).toEqual(stored(input));
    },
  );

  describe("generated formulations", () => {
    const demo = demoInputs()[1]!.input; // HC-3 r2: GPTMS + TEOS + Ti isopropoxide, fill solvent
    const awkwardName = fc.oneof(
      // A name with a tab or another control character is refused on import (the shared text rule); a leading
      // tab's neutralising on export is checked in spreadsheet-export.test.ts.
      fc.constantFrom("=cmd|' /C calc'!A0", "+SUM(A1)", "-neg", "@at", "Plain, with comma", 'Quote "q"', "Ünïcode µ"),
      fc.string({ minLength: 1, maxLength: 30 }).filter((s) => s.trim() === s && s.trim().length > 0 && !/^\[.*\]$/.test(s) && !s.startsWith("'")),
    );
    const arb = fc.record({
      name: awkwardName,
      f1: fc.double({ min: 0.01, max: 0.98, noNaN: true }),
      grams: fc.double({ min: 0.001, max: 1e5, noNaN: true }),
      r: fc.double({ min: 0, max: 20, noNaN: true }),
      temps: fc.array(
        fc.record({
          t: fc.double({ min: -40, max: 400, noNaN: true }),
          h: fc.double({ min: 0, max: 500, noNaN: true }),
          stage: fc.option(fc.constantFrom(...STEP_STAGES), { nil: undefined }),
          atmosphere: fc.option(fc.constantFrom(...STEP_ATMOSPHERES), { nil: undefined }),
        }),
        { maxLength: 6 },
      ),
      waterRatio: fc.constantFrom(...WATER_RATIOS),
      countCarried: fc.option(fc.boolean(), { nil: undefined }),
      margin: fc.option(fc.double({ min: 0, max: 100, noNaN: true }), { nil: undefined }),
      order: fc.boolean(),
      stepName: awkwardName,
    });

    it("returns the same FormulationInput for 25 generated formulations with awkward names and full-precision numbers", async () => {
      await fc.assert(
        fc.asyncProperty(arb, async (g) => {
          const [gptms, teos] = demo.components;
          const f2 = 1 - g.f1;
          const materials: Material[] = demo.materials.map((m) => (m.id === gptms!.materialId ? { ...m, name: g.name } : m));
          const input: FormulationInput = {
            ...demo,
            materials,
            basis: { type: "solidMass", grams: g.grams },
            components: [
              { materialId: gptms!.materialId, weightFraction: g.f1 },
              { materialId: teos!.materialId, weightFraction: f2 },
            ],
            solvent: { materialId: demo.solvent!.materialId, mode: "molPerNetworkAtom", value: g.r * 2 },
            water: {
              materialId: demo.water.materialId,
              ratio: g.waterRatio,
              value: g.r,
              ...(g.waterRatio === "perPrecursor" ? { referenceId: teos!.materialId } : {}),
              ...(g.countCarried !== undefined ? { countCarried: g.countCarried } : {}),
            },
            steps: g.temps.map((s, i) => ({
              name: `${g.stepName} ${i}`,
              temperatureC: s.t,
              durationH: s.h,
              ...(s.stage ? { stage: s.stage } : {}),
              ...(s.atmosphere ? { atmosphere: s.atmosphere } : {}),
            })),
            marginC: g.margin,
            additionOrder: g.order ? [teos!.materialId, gptms!.materialId] : undefined,
          };
          // Only GPTMS and TEOS here: the demo's modifier of its titanium alkoxide does not apply.
          delete input.modifiers;
          if (input.marginC === undefined) delete input.marginC;
          if (input.additionOrder === undefined) delete input.additionOrder;
          const back = await roundTripXlsx(`Generated ${g.name}`, input);
          expect(back.problems.filter((p) => p.level === "error")).toEqual([]);
          expect(stored(back.input!)).toEqual(stored(input));
        }),
        { numRuns: 25 },
      );
    }, 120_000);
  });
});
