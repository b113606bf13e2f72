import { describe, expect, it } from "vitest";
import { correctLotSchema, lotCorrectionFormSchema } from "./lots";

const issues = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).map((i) => [i.path.join(".") || "body", i.message]));

describe("correctLotSchema", () => {
  it("returns the corrected fields with the version; null clears the assay, the expiry date and the notes", () => {
    expect(correctLotSchema.parse({ version: 3, supplier: "  Acme  ", measuredAssay: null, expiresOn: null, notes: null })).toEqual({
      version: 3,
      supplier: "Acme",
      measuredAssay: null,
      expiresOn: null,
      notes: null,
    });
  });

  describe("edge cases", () => {
    it("refuses a body with only the version, naming no field but saying what may be sent", () => {
      const r = correctLotSchema.safeParse({ version: 1 });
      expect(issues(r).body).toMatch(/at least one of supplier, supplierLot, expiresOn, measuredAssay, notes/);
    });

    it("refuses a missing version, unknown fields and the quantities", () => {
      expect(issues(correctLotSchema.safeParse({ supplier: "A" }))).toHaveProperty("version");
      expect(correctLotSchema.safeParse({ version: 1, quantity: 5 }).success).toBe(false);
      expect(correctLotSchema.safeParse({ version: 1, quantityOnHand: 5, supplier: "A" }).success).toBe(false);
    });

    it("uses the receiving messages: an assay above 1 or at 0, a date that does not exist", () => {
      expect(issues(correctLotSchema.safeParse({ version: 1, measuredAssay: 1.2 })).measuredAssay).toBe("The measured assay is a mass fraction: at most 1");
      expect(issues(correctLotSchema.safeParse({ version: 1, measuredAssay: 0 })).measuredAssay).toBe("The measured assay must be greater than 0");
      expect(issues(correctLotSchema.safeParse({ version: 1, expiresOn: "2026-02-30" })).expiresOn).toBe("The expiry date is not a real date");
      expect(issues(correctLotSchema.safeParse({ version: 1, supplierLot: "" }))).toHaveProperty("supplierLot");
    });
  });
});

describe("lotCorrectionFormSchema", () => {
  it("reads the typed text: an empty date, assay or notes is null, a decimal comma is a point", () => {
    expect(lotCorrectionFormSchema.parse({ supplier: "Acme", supplierLot: "L-1", expiresOn: "", measuredAssay: "0,95", notes: " " })).toEqual({
      supplier: "Acme",
      supplierLot: "L-1",
      expiresOn: null,
      measuredAssay: 0.95,
      notes: null,
    });
  });

  it("refuses an assay that is not a number with the route's message", () => {
    const r = lotCorrectionFormSchema.safeParse({ supplier: "Acme", supplierLot: "L-1", expiresOn: "", measuredAssay: "abc", notes: "" });
    expect(issues(r).measuredAssay).toBe("The measured assay must be a number (a mass fraction, 0–1)");
  });
});
