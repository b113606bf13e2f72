/**
 * The weighing entry's own arithmetic and reading of what is typed
 * (components/batches/line-draft.ts, batch-deviation.ts): masses as people
 * type them, what a line save sends, the live tolerance check while typing,
 * and the words a deviation is shown in. The tolerance rule
 * |actual − target| > max(tolerance × target, balance resolution) is the
 * server's (lib/spreadsheet/batch-record.ts); common practice, no source.
 */
import { describe, expect, it } from "vitest";
import { deviationWords, liveDeviation, toleranceWords } from "@/components/batches/batch-deviation";
import { closeProblems, draftOf, entryCounts, isDirty, lineChanges, massProblem, parseMass, shownDeviation, shownLot } from "@/components/batches/line-draft";
import { batchUrls, type Batch, type BatchLine } from "@/lib/client/batches";

const NBSP = "\u00a0";

function line(values: Partial<BatchLine> = {}): BatchLine {
  return { index: 0, materialId: "teos", name: "TEOS", role: "precursor", targetGrams: 100, actualGrams: null, lotNumber: null, lotId: null, deviation: null, ...values };
}

const settings = { toleranceFraction: 0.01, balanceResolutionGrams: 0.01 };

function batchOf(lines: BatchLine[]): Batch {
  return { ...settings, lines } as unknown as Batch;
}

describe("parseMass", () => {
  it("reads grams written with a point, a comma or a trailing g", () => {
    expect(parseMass("12.34")).toEqual({ value: 12.34 });
    expect(parseMass(" 12,34 g ")).toEqual({ value: 12.34 });
    expect(parseMass("12.")).toEqual({ value: 12 });
    expect(parseMass(".5")).toEqual({ value: 0.5 });
  });

  it("reads a blank field as no mass", () => {
    expect(parseMass("   ")).toEqual({ value: null });
  });

  describe("edge cases", () => {
    it("refuses a negative mass, another unit, an exponent and an absurd mass, each with its reason", () => {
      expect(parseMass("-3").error).toBe("The actual mass must not be negative.");
      expect(parseMass("12,3 kg").error).toBe("Write the mass in g as a number, e.g. 12.34.");
      expect(parseMass("1e3").error).toBe("Write the mass in g as a number, e.g. 12.34.");
      expect(parseMass("20000000").error).toBe("At most 10,000,000 g.");
    });

    it("names the line (counted from 1) in the problem", () => {
      expect(massProblem(2, "abc")).toEqual({ field: "mass", message: "Line 3, actual mass: Write the mass in g as a number, e.g. 12.34." });
      expect(massProblem(2, "4.2")).toBeUndefined();
    });
  });
});

describe("lineChanges", () => {
  it("sends only the fields that changed, with a lot number trimmed", () => {
    const saved = line({ actualGrams: 50, lotNumber: "L-1" });
    expect(lineChanges(0, { mass: "50", lot: " L-2 " }, saved)).toEqual({ body: { lotNumber: "L-2" } });
    expect(lineChanges(0, { mass: "51", lot: "L-1" }, saved)).toEqual({ body: { actualGrams: 51 } });
    expect(lineChanges(0, { mass: "", lot: "" }, saved)).toEqual({ body: { actualGrams: null, lotNumber: null } });
  });

  it("sends nothing for a line as saved, and the problem for a mass that cannot be read", () => {
    const saved = line({ actualGrams: 50, lotNumber: "L-1" });
    expect(lineChanges(0, draftOf(saved), saved)).toEqual({ body: null });
    expect(isDirty(draftOf(saved), saved)).toBe(false);
    expect(lineChanges(4, { mass: "fifty", lot: "L-1" }, saved).problem?.message).toMatch(/^Line 5, actual mass:/);
    expect(isDirty({ mass: "fifty", lot: "L-1" }, saved)).toBe(true);
  });

  it("never sends a typed lot number over a picked lot's, and shows the lot's number", () => {
    const picked = line({ actualGrams: 50, lotNumber: "SUP-7", lotId: "lot-1" });
    // Text typed before the lot was picked (or changed by hand since) is neither saved nor shown.
    expect(lineChanges(0, { mass: "50", lot: "typed by hand" }, picked)).toEqual({ body: null });
    expect(lineChanges(0, { mass: "52", lot: "" }, picked)).toEqual({ body: { actualGrams: 52 } });
    expect(isDirty({ mass: "50", lot: "typed by hand" }, picked)).toBe(false);
    expect(shownLot({ mass: "50", lot: "typed by hand" }, picked)).toBe("SUP-7");
    expect(shownLot({ mass: "50", lot: "typed" }, line({ lotNumber: "SUP-7" }))).toBe("typed");
  });
});

describe("liveDeviation", () => {
  it("flags 5 % over a 100 g target as outside ±1 % (tolerance 1 g)", () => {
    expect(liveDeviation(100, 105, 0.01, 0.01)).toEqual({ absoluteGrams: 5, relative: 0.05, toleranceGrams: 1, outside: true });
  });

  it("never allows less than the balance resolution: 0.5 g ± 1 % is ± 0.01 g on a 0.01 g balance", () => {
    const d = liveDeviation(0.5, 0.509, 0.01, 0.01);
    expect(d.toleranceGrams).toBe(0.01);
    expect(d.outside).toBe(false);
  });

  describe("edge cases", () => {
    it("keeps a mass exactly at the limit within tolerance despite float noise (10.1 g + 1 % = 10.201 g)", () => {
      // In binary floating point 10.201 − 10.1 exceeds 10.1 × 0.01; the check must not flag it.
      expect(10.201 - 10.1 > 10.1 * 0.01).toBe(true);
      expect(liveDeviation(10.1, 10.201, 0.01, 0.01).outside).toBe(false);
      expect(liveDeviation(10.1, 10.202, 0.01, 0.01).outside).toBe(true);
    });

    it("has no relative deviation for a zero target", () => {
      expect(liveDeviation(0, 0.02, 0.01, 0.01)).toMatchObject({ relative: null, outside: true });
    });
  });
});

describe("deviationWords", () => {
  it("writes the signed mass at the balance resolution and the percentage", () => {
    expect(deviationWords({ absoluteGrams: 4.95, relative: 0.05, toleranceGrams: 1, outside: true }, 0.01)).toBe(`+4.95${NBSP}g (+5.0${NBSP}%)`);
    expect(deviationWords({ absoluteGrams: -0.3, relative: -0.003, toleranceGrams: 1, outside: false }, 0.1)).toBe(`−0.3${NBSP}g (−0.3${NBSP}%)`);
  });

  it("writes a deviation that rounds to nothing without a sign", () => {
    expect(deviationWords({ absoluteGrams: 0.001, relative: 0.00001, toleranceGrams: 1, outside: false }, 0.01)).toBe(`±0.00${NBSP}g (0.0${NBSP}%)`);
  });

  it("writes the tolerance with one decimal only below 1 %", () => {
    expect(toleranceWords(0.01)).toBe(`±1${NBSP}%`);
    expect(toleranceWords(0.005)).toBe(`±0.5${NBSP}%`);
  });
});

describe("shownDeviation", () => {
  const saved = line({ actualGrams: 100, deviation: { absoluteGrams: 0, relative: 0, toleranceGrams: 1, outside: false } });

  it("works out a typed, unsaved mass live", () => {
    expect(shownDeviation(saved, { mass: "103", lot: "" }, settings)).toEqual({
      deviation: liveDeviation(100, 103, 0.01, 0.01),
      live: true,
    });
  });

  it("shows no deviation while a saved mass is being cleared, and the server's for a line as saved", () => {
    expect(shownDeviation(saved, { mass: "", lot: "" }, settings)).toEqual({ deviation: null, live: true });
    expect(shownDeviation(saved, { mass: "100", lot: "" }, settings)).toEqual({ deviation: saved.deviation, live: false });
  });
});

describe("entryCounts", () => {
  it("counts typed masses, lines outside tolerance and missing lot numbers (water needs none)", () => {
    const batch = batchOf([line(), line({ index: 1, role: "water", targetGrams: 20 }), line({ index: 2, targetGrams: 10 })]);
    const counts = entryCounts(batch, [
      { mass: "100", lot: "L-1" },
      { mass: "25", lot: "" },
      { mass: "", lot: "" },
    ]);
    expect(counts).toEqual({ weighed: 2, outside: 1, missingLot: 1 });
  });

  it("counts a line with a picked lot as having its lot number, whatever its draft says", () => {
    const batch = batchOf([line({ lotNumber: "SUP-7", lotId: "lot-1" })]);
    expect(entryCounts(batch, [{ mass: "", lot: "" }]).missingLot).toBe(0);
  });
});

describe("closeProblems", () => {
  it("maps a refused close's fields to the lines and fields they name, ignoring any other field", () => {
    expect(
      closeProblems({
        "lines.0.actualGrams": "Line 1 (TEOS) has no actual mass.",
        "lines.3.lotNumber": "Line 4 (MTES) has no lot number.",
        notes: "Too long.",
      }),
    ).toEqual({
      0: { field: "mass", message: "Line 1 (TEOS) has no actual mass." },
      3: { field: "lot", message: "Line 4 (MTES) has no lot number." },
    });
  });
});

describe("batchUrls", () => {
  it("builds the list's query from the filters given, and escapes an id", () => {
    expect(batchUrls.list()).toBe("/api/batches");
    expect(batchUrls.list({ formulationId: undefined, state: "open" })).toBe("/api/batches?state=open");
    expect(batchUrls.line("a/b", 3)).toBe("/api/batches/a%2Fb/lines/3");
    expect(batchUrls.close("b-1")).toBe("/api/batches/b-1/close");
  });
});
