/**
 * The shared text rule. Code points from the Unicode Standard (UAX #9 for
 * the bidirectional controls; the General_Category Cf list for the format
 * characters).
 */
import { describe, expect, it } from "vitest";
import { materialSchema } from "./material-schema";
import { multilineText, nameText, textProblem } from "./text-rules";

describe("textProblem", () => {
  it("returns null for ordinary names in any script, with emoji and joined sequences", () => {
    for (const ok of ["Ethanol", "Tetraethyl orthosilicate (TEOS)", "Титан(IV) бутоксид", "酢酸", "العربية", "Lab 👩‍🔬 team", "a\u200Bb"]) {
      expect(textProblem(ok), ok).toBeNull();
    }
  });

  it("returns 'must contain visible characters' for names made only of invisible characters", () => {
    for (const bad of [" ", "   ", "\u200B", "\u2060", "\uFEFF", "\u00AD", "\u200B\u200C\u200D", "\u3164", "\u2800", "\uFE0F", "\u00A0\u3000"]) {
      expect(textProblem(bad), JSON.stringify(bad)).toBe("must contain visible characters");
    }
  });

  it("names the bidirectional control it refuses", () => {
    const controls = [0x061c, 0x200e, 0x200f, 0x202a, 0x202b, 0x202c, 0x202d, 0x202e, 0x2066, 0x2067, 0x2068, 0x2069];
    for (const cp of controls) {
      const hex = cp.toString(16).toUpperCase().padStart(4, "0");
      expect(textProblem(`TEOS ${String.fromCodePoint(cp)}batch`)).toBe(`must not contain the bidirectional control U+${hex}`);
    }
  });

  it("refuses NUL and other control characters on one line; allows line breaks and tabs in multi-line text", () => {
    expect(textProblem("TEOS\u0000")).toBe("must not contain the control character U+0000");
    expect(textProblem("a\u001Bb")).toBe("must not contain the control character U+001B");
    expect(textProblem("a\nb")).toBe("must not contain the control character U+000A");
    expect(textProblem("a\u0085b")).toBe("must not contain the control character U+0085");
    expect(textProblem("line 1\r\n\tline 2", { multiline: true })).toBeNull();
    expect(textProblem("a\u0007b", { multiline: true })).toBe("must not contain the control character U+0007");
  });

  it("refuses a lone UTF-16 surrogate, high or low, but not a pair", () => {
    expect(textProblem("a\uD83D")).toMatch(/lone UTF-16 surrogate/);
    expect(textProblem("\uDE00b")).toMatch(/lone UTF-16 surrogate/);
    expect(textProblem("\uD83D\uDE00")).toBeNull();
  });
});

describe("nameText", () => {
  it("returns the name; with trim, without the surrounding white space", () => {
    expect(nameText("name", { max: 10 }).parse("TEOS")).toBe("TEOS");
    expect(nameText("name", { max: 10, trim: true }).parse("  TEOS ")).toBe("TEOS");
  });

  describe("edge cases", () => {
    it("refuses empty, over-long and invisible names with the label in the message", () => {
      expect(nameText("team name", { max: 5 }).safeParse("").error?.issues[0]?.message).toBe("team name must not be empty");
      expect(nameText("team name", { max: 5 }).safeParse("abcdef").error?.issues[0]?.message).toBe("team name must be at most 5 characters");
      expect(nameText("team name", { max: 5 }).safeParse("\u2060").error?.issues[0]?.message).toBe("team name must contain visible characters");
      expect(nameText("team name", { max: 5 }).safeParse(5).error?.issues[0]?.message).toBe("team name must be text");
    });
  });
});

describe("multilineText", () => {
  it("returns trimmed notes and allows empty notes", () => {
    expect(multilineText("notes", { max: 100 }).parse(" a\nb ")).toBe("a\nb");
    expect(multilineText("notes", { max: 100 }).parse("")).toBe("");
  });
  it("refuses notes made only of zero-width spaces and notes with a bidi override", () => {
    expect(multilineText("notes", { max: 100 }).safeParse("\u200B\u200B").success).toBe(false);
    expect(multilineText("notes", { max: 100 }).safeParse("ok \u202E").success).toBe(false);
  });
});

describe("materialSchema name", () => {
  const ethanol = { id: "ethanol", kind: "solvent", formula: "C2H6O", molarMass: 46.069, density: 0.7893 };
  it("accepts 200 characters and refuses 201 (the database column holds 200)", () => {
    expect(materialSchema.safeParse({ ...ethanol, name: "x".repeat(200) }).success).toBe(true);
    const r = materialSchema.safeParse({ ...ethanol, name: "x".repeat(201) });
    expect(r.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([["name", "material name must be at most 200 characters"]]);
  });
  it("refuses a name of zero-width spaces and a name with a right-to-left override, at path name", () => {
    for (const name of ["\u200B\u200B", "Ethanol\u202Elonahte"]) {
      expect(materialSchema.safeParse({ ...ethanol, name }).error?.issues[0]?.path).toEqual(["name"]);
    }
  });
});
