import { describe, expect, it } from "vitest";
import { correctedGrams, gramsInLotUnit } from "./lot-amount";

describe("gramsInLotUnit", () => {
  // 1 kg = 1000 g; 1 L = 1000 mL; volume = mass / density (SI definitions, common practice, no source).
  it("converts to kg, mL and L", () => {
    expect(gramsInLotUnit(1500, "kg")).toBe(1.5);
    expect(gramsInLotUnit(12.5, "g")).toBe(12.5);
    // TEOS density 0.934 g/cm³ (from memory): 93.4 g is 100 mL, 0.1 L.
    expect(gramsInLotUnit(93.4, "mL", 0.934)).toBeCloseTo(100, 12);
    expect(gramsInLotUnit(93.4, "L", 0.934)).toBeCloseTo(0.1, 12);
  });
  it("gives null for a volume unit without density", () => {
    expect(gramsInLotUnit(10, "mL")).toBeNull();
    expect(gramsInLotUnit(10, "L", 0)).toBeNull();
  });
});

describe("correctedGrams", () => {
  // Same active mass: 100 g × 0.98 = 98 g active; 98 / 0.95 = 103.1578947… g (arithmetic by hand).
  it("keeps the active mass", () => {
    expect(correctedGrams(100, 0.98, 0.95)).toBeCloseTo(103.157894736842, 10);
    expect(correctedGrams(50, undefined, 0.5)).toBe(100);
  });
});
