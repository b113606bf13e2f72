/**
 * The import wizard's checks before a file is sent and its reading of the
 * server's answers (components/imports/import-words.ts, lib/client/imports.ts).
 */
import { describe, expect, it } from "vitest";
import { fileProblem, UPLOAD_LIMIT_WORDS } from "@/components/imports/import-words";
import { createdIds, importUrls, type ImportConfirmation } from "@/lib/client/imports";
import { IMPORT_LIMITS } from "@/lib/spreadsheet/template";

describe("fileProblem", () => {
  it("lets a workbook or CSV file within the size limit through", () => {
    expect(fileProblem(new File(["a,b"], "library.csv"))).toBeNull();
    expect(fileProblem(new File(["x"], "Hard coat.XLSX"))).toBeNull();
  });

  describe("edge cases", () => {
    it("names a file that is neither a workbook nor a CSV file", () => {
      expect(fileProblem(new File(["hello"], "notes.txt"))).toBe("“notes.txt” is not a workbook (.xlsx) or a CSV file.");
    });

    it("names a file over the server's byte limit with its size", () => {
      const big = new File([new Uint8Array(IMPORT_LIMITS.maxBytes + 1)], "big.xlsx");
      expect(fileProblem(big)).toBe("“big.xlsx” is 5.0\u00a0MB; at most 5 MB is read.");
    });
  });

  it("states the server's limits in the field's hint", () => {
    expect(UPLOAD_LIMIT_WORDS).toBe("up to 5 MB, 5,000 rows per sheet, 20 sheets");
  });
});

describe("createdIds", () => {
  const answer = (outcome: Record<string, unknown>) => ({ id: "i", kind: "formulation", state: "confirmed", outcome }) as ImportConfirmation;

  it("reads the new formulation and revision of a confirmed formulation import", () => {
    expect(createdIds(answer({ formulationId: "f-1", revisionId: "r-1", createdMaterials: [] }))).toEqual({ formulationId: "f-1", revisionId: "r-1" });
  });

  it("has neither for a materials import, and ignores values that are not ids", () => {
    expect(createdIds(answer({ createdMaterials: [] }))).toEqual({ formulationId: undefined, revisionId: undefined });
    expect(createdIds(answer({ formulationId: 7, revisionId: null }))).toEqual({ formulationId: undefined, revisionId: undefined });
  });
});

describe("importUrls", () => {
  it("escapes an id and builds the template link of each kind and format", () => {
    expect(importUrls.confirm("a/b")).toBe("/api/imports/a%2Fb/confirm");
    expect(importUrls.template("materials", "csv")).toBe("/api/templates/materials?format=csv");
  });
});
