import { describe, expect, it } from "vitest";
import type { ZodError } from "zod";
import { ADJUSTMENT_NOTE_MAX, adjustLotSchema, lotAdjustmentFormSchema } from "@/lib/validations/lot-adjustments";

// The rules are the product's own (a count on the shelf, in the lot's unit); no external source.

/** Every issue of a failed parse as "path: message". */
function issues(schema: { safeParse: (v: unknown) => { success: boolean; error?: ZodError } }, value: unknown): string[] {
  const r = schema.safeParse(value);
  expect(r.success).toBe(false);
  return r.error!.issues.map((i) => `${i.path.join(".")}: ${i.message}`);
}

const ok = { version: 3, quantityOnHand: 412.5, reason: "recount" };

describe("adjustLotSchema", () => {
  it("returns the adjustment for each reason, a note optional except for other", () => {
    for (const reason of ["recount", "damaged", "disposed", "sample"]) {
      expect(adjustLotSchema.parse({ ...ok, reason })).toEqual({ ...ok, reason });
    }
    expect(adjustLotSchema.parse({ ...ok, reason: "other", note: "  lent to the pilot line  " })).toEqual({ ...ok, reason: "other", note: "lent to the pilot line" });
    expect(adjustLotSchema.parse({ ...ok, note: null }).note).toBeNull();
  });

  it("returns a count of 0 (the lot emptied) and the largest count allowed", () => {
    expect(adjustLotSchema.parse({ ...ok, quantityOnHand: 0 }).quantityOnHand).toBe(0);
    expect(adjustLotSchema.parse({ ...ok, quantityOnHand: 1e9 }).quantityOnHand).toBe(1e9);
  });

  describe("edge cases", () => {
    it("refuses other without a note, or with a blank one, naming note", () => {
      for (const note of [undefined, null, "", "   \n "]) {
        expect(issues(adjustLotSchema, { ...ok, reason: "other", note })).toEqual(['note: The note is required when the reason is "other": say what happened']);
      }
    });

    it("refuses an unknown reason, naming reason", () => {
      for (const reason of ["lost", "Recount", "", 1, null]) {
        expect(issues(adjustLotSchema, { ...ok, reason })).toEqual(['reason: The reason must be one of "recount", "damaged", "disposed", "sample" or "other"']);
      }
    });

    it("refuses a negative, NaN, infinite, huge or text quantity, naming quantityOnHand", () => {
      expect(issues(adjustLotSchema, { ...ok, quantityOnHand: -0.001 })).toEqual(["quantityOnHand: The quantity on hand must not be negative"]);
      expect(issues(adjustLotSchema, { ...ok, quantityOnHand: 1e9 + 1 })).toEqual(["quantityOnHand: The quantity on hand is too large"]);
      for (const q of [Number.NaN, Number.POSITIVE_INFINITY, "12", null, undefined, { value: 1 }]) {
        const found = issues(adjustLotSchema, { ...ok, quantityOnHand: q });
        expect(found).toHaveLength(1);
        expect(found[0]).toMatch(/^quantityOnHand: The quantity on hand must be a number/);
      }
    });

    it("refuses a missing, fractional or zero version, naming version", () => {
      expect(issues(adjustLotSchema, { quantityOnHand: 1, reason: "recount" })[0]).toMatch(/^version: The version must be a number/);
      expect(issues(adjustLotSchema, { ...ok, version: 1.5 })).toEqual(["version: The version must be a whole number"]);
      expect(issues(adjustLotSchema, { ...ok, version: 0 })).toEqual(["version: The version must be at least 1"]);
    });

    it("refuses unknown fields (a delta, a unit) rather than ignoring them", () => {
      const found = issues(adjustLotSchema, { ...ok, delta: -5, unit: "kg" });
      expect(found.join(" ")).toMatch(/delta/);
      expect(found.join(" ")).toMatch(/unit/);
    });

    it("refuses a note longer than the limit or with a control character, naming note", () => {
      expect(issues(adjustLotSchema, { ...ok, note: "x".repeat(ADJUSTMENT_NOTE_MAX + 1) })).toEqual([`note: The note must be at most ${ADJUSTMENT_NOTE_MAX} characters`]);
      expect(issues(adjustLotSchema, { ...ok, note: "spill\u0007" })[0]).toMatch(/^note: The note must not contain the control character/);
      expect(adjustLotSchema.parse({ ...ok, note: "x".repeat(ADJUSTMENT_NOTE_MAX) }).note).toHaveLength(ADJUSTMENT_NOTE_MAX);
    });

    it("refuses an empty body with every required field named", () => {
      const paths = issues(adjustLotSchema, {}).map((s) => s.split(":")[0]);
      expect(paths.sort()).toEqual(["quantityOnHand", "reason", "version"]);
    });
  });
});

describe("lotAdjustmentFormSchema", () => {
  it("returns the typed count as a number (comma or point) and an empty note as none", () => {
    expect(lotAdjustmentFormSchema.parse({ quantityOnHand: " 12,5 ", reason: "damaged", note: "  " })).toEqual({ quantityOnHand: 12.5, reason: "damaged", note: null });
    expect(lotAdjustmentFormSchema.parse({ quantityOnHand: "0", reason: "disposed", note: "expired" })).toEqual({ quantityOnHand: 0, reason: "disposed", note: "expired" });
  });

  describe("edge cases", () => {
    it("refuses an empty or non-numeric count and a negative one with the route's messages", () => {
      expect(issues(lotAdjustmentFormSchema, { quantityOnHand: "", reason: "recount", note: "" })[0]).toMatch(/^quantityOnHand: The quantity on hand must be a number/);
      expect(issues(lotAdjustmentFormSchema, { quantityOnHand: "ten", reason: "recount", note: "" })[0]).toMatch(/^quantityOnHand: The quantity on hand must be a number/);
      expect(issues(lotAdjustmentFormSchema, { quantityOnHand: "-1", reason: "recount", note: "" })).toEqual(["quantityOnHand: The quantity on hand must not be negative"]);
    });

    it("asks for a note when the reason is other", () => {
      expect(issues(lotAdjustmentFormSchema, { quantityOnHand: "5", reason: "other", note: " " })).toEqual(['note: The note is required when the reason is "other": say what happened']);
    });
  });
});
