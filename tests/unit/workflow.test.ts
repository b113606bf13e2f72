import { describe, expect, it } from "vitest";
import type { FormulationResult } from "@/lib/formulation";
import { ConflictError, RuleError } from "@/lib/errors";
import { assertReviewable, assertSubmittable, nextState, WorkflowError } from "@/lib/workflow";

// The lifecycle rules are the product's own (DEVELOPERS.md, "Lifecycle"); no external source.
describe("nextState", () => {
  it("returns the state each action leads to", () => {
    expect(nextState("draft", "submit")).toBe("in_review");
    expect(nextState("in_review", "approve")).toBe("approved");
    expect(nextState("in_review", "return")).toBe("draft");
    expect(nextState("approved", "release")).toBe("released");
    expect(nextState("released", "archive")).toBe("archived");
  });

  describe("edge cases", () => {
    it("refuses actions from the wrong state with a wrong_state error", () => {
      for (const [state, action] of [
        ["draft", "approve"],
        ["approved", "submit"],
        ["released", "release"],
        ["archived", "archive"],
        ["in_review", "release"],
      ] as const) {
        expect(() => nextState(state, action)).toThrow(ConflictError);
        expect(() => nextState(state, action)).toThrow(expect.objectContaining({ code: "wrong_state" }));
      }
    });
  });
});

const withNotices = (levels: ("info" | "caution" | "error")[]) =>
  ({ notices: levels.map((level, i) => ({ level, code: `c${i}`, message: `notice ${i}` })) }) as unknown as FormulationResult;

describe("assertSubmittable", () => {
  it("accepts a result with only info and caution notices", () => {
    expect(() => assertSubmittable(withNotices(["info", "caution"]), null)).not.toThrow();
  });
  it("refuses with a WorkflowError, a RuleError (422) with code has_errors", () => {
    let thrown: unknown;
    try {
      assertSubmittable(null, "no result");
    } catch (err) {
      thrown = err;
    }
    expect(thrown).toBeInstanceOf(WorkflowError);
    expect(thrown).toBeInstanceOf(RuleError);
    expect(thrown).toMatchObject({ code: "has_errors" });
  });
  it("refuses a result with an error notice or no result", () => {
    expect(() => assertSubmittable(withNotices(["info", "error"]), null)).toThrow(/error notice/);
    expect(() => assertSubmittable(null, "weight fractions sum to 0.9")).toThrow(/0\.9/);
  });
});

describe("assertReviewable", () => {
  const base = { reviewerId: "r", authorIds: ["a"], comment: null, thermalStatus: "clear" as const };
  it("lets another person approve a clear revision without a comment", () => {
    expect(() => assertReviewable({ ...base, decision: "approved" })).not.toThrow();
  });
  it("refuses the author's own revision, either way", () => {
    expect(() => assertReviewable({ ...base, reviewerId: "a", decision: "approved" })).toThrow(/another reviewer/);
    expect(() => assertReviewable({ ...base, reviewerId: "a", decision: "returned", comment: "x" })).toThrow(/another reviewer/);
  });
  it("refuses everyone who authored a change (creator, editor, submitter), not only the creator", () => {
    const authors = { ...base, authorIds: ["creator", "editor", "submitter"] };
    for (const reviewerId of authors.authorIds) {
      expect(() => assertReviewable({ ...authors, reviewerId, decision: "approved" })).toThrow(/another reviewer/);
    }
    expect(() => assertReviewable({ ...authors, reviewerId: "r", decision: "approved" })).not.toThrow();
  });
  it("refuses to approve a thermal fail, even with a comment", () => {
    expect(() => assertReviewable({ ...base, decision: "approved", thermalStatus: "fail", comment: "fine" })).toThrow(/cannot be approved/);
  });
  it("needs a comment for a thermal caution and for a return", () => {
    expect(() => assertReviewable({ ...base, decision: "approved", thermalStatus: "caution" })).toThrow(/comment/);
    expect(() => assertReviewable({ ...base, decision: "approved", thermalStatus: "caution", comment: "ok at 2 h" })).not.toThrow();
    expect(() => assertReviewable({ ...base, decision: "returned", comment: "   " })).toThrow(/comment/);
  });
});

describe("assertSubmittable and the thermal check", () => {
  it("lets a thermal fail reach the reviewer, who cannot approve it", () => {
    const result = {
      notices: [{ level: "error", code: "thermal_limit_exceeded", message: "Cure at 150 °C vs polycarbonate" }],
    } as unknown as FormulationResult;
    expect(() => assertSubmittable(result, null)).not.toThrow();
  });
});
