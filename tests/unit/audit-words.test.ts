import { describe, expect, it } from "vitest";
import { actionWords, eventHref, summaryWords } from "@/components/history/audit-words";

// The words are the product's own; no external source.
describe("audit words for batch records", () => {
  it("returns plain words for a change of batch notes, with the notes before and after", () => {
    expect(actionWords("batch.notes_changed")).toBe("changed a batch's notes");
    expect(summaryWords({ before: { notes: null }, after: { notes: "Dried at 60 °C" } })).toBe("notes none → “Dried at 60 °C”");
  });

  it("returns the line and the initials that changed for a weighing, and leaves unchanged values out", () => {
    expect(actionWords("batch.line_recorded")).toBe("recorded a weighing");
    const summary = {
      before: { line: 2, actualGrams: 10.5, lotNumber: "L-1", initials: "AB" },
      after: { line: 2, actualGrams: 10.5, lotNumber: "L-1", initials: "CD" },
    };
    expect(summaryWords(summary)).toBe("line 2 · initials “AB” → “CD”");
    expect(eventHref({ entityType: "batch", entityId: "b1" })).toBe("/batches/b1");
  });
});

describe("audit words for a lot's stock adjustment", () => {
  it("returns the amount on hand before and after with the lot's unit, the reason in words and the note", () => {
    expect(actionWords("lot.adjusted")).toBe("adjusted a lot's stock on hand");
    const summary = { before: { quantityOnHand: 500, version: 1 }, after: { quantityOnHand: 482.5, version: 2, unit: "g", reason: "damaged" }, note: "bottle cracked" };
    expect(summaryWords(summary)).toBe("version 2 · on hand 500 g → 482.5 g · Spilled or damaged · “bottle cracked”");
  });
});
