import { describe, expect, it } from "vitest";
import { can } from "@/lib/permissions";

// Who may do what is the product's own rule set (README "Demo accounts"); no external source.
describe("can", () => {
  it("lets formulators and admins edit drafts, and nobody else", () => {
    expect(can("formulator", "formulation:update")).toBe(true);
    expect(can("admin", "formulation:update")).toBe(true);
    expect(can("reviewer", "formulation:update")).toBe(false);
    expect(can("production", "formulation:update")).toBe(false);
  });
  it("lets only reviewers review", () => {
    expect(can("reviewer", "formulation:review")).toBe(true);
    for (const role of ["admin", "formulator", "production"]) expect(can(role, "formulation:review")).toBe(false);
  });
  it("keeps production to released work and batch records", () => {
    expect(can("production", "formulation:readUnreleased")).toBe(false);
    expect(can("production", "batch:create")).toBe(true);
  });
  it("lets only admins manage members", () => {
    expect(can("admin", "member:update")).toBe(true);
    expect(can("formulator", "member:update")).toBe(false);
  });
  describe("edge cases", () => {
    it("refuses unknown or missing roles", () => {
      expect(can(undefined, "formulation:read")).toBe(false);
      expect(can("owner", "formulation:read")).toBe(false);
    });
  });
});
