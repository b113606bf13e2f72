import { describe, expect, it } from "vitest";
import { IMPORT_KINDS } from "@/lib/enums";
import { ATTACHMENT_PERMISSIONS, can, IMPORT_PERMISSIONS, REVISION_ACTION_PERMISSIONS } from "@/lib/permissions";
import { ATTACHMENT_OWNER_TYPES } from "@/lib/validations/uploads";

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

describe("permission maps by kind", () => {
  it("returns a permission for every kind a request can be about", () => {
    expect(Object.keys(REVISION_ACTION_PERMISSIONS).sort()).toEqual(["approve", "archive", "release", "return", "submit"]);
    expect(Object.keys(IMPORT_PERMISSIONS).sort()).toEqual([...IMPORT_KINDS].sort());
    for (const access of ["read", "write"] as const) expect(Object.keys(ATTACHMENT_PERMISSIONS[access]).sort()).toEqual([...ATTACHMENT_OWNER_TYPES].sort());
  });
  it("lets production read and change a batch record's documents but only read a material's", () => {
    expect(can("production", ATTACHMENT_PERMISSIONS.write.batch)).toBe(true);
    expect(can("production", ATTACHMENT_PERMISSIONS.read.material)).toBe(true);
    expect(can("production", ATTACHMENT_PERMISSIONS.write.material)).toBe(false);
  });
  it("lets a reviewer approve and return but not submit", () => {
    expect(can("reviewer", REVISION_ACTION_PERMISSIONS.approve)).toBe(true);
    expect(can("reviewer", REVISION_ACTION_PERMISSIONS.return)).toBe(true);
    expect(can("reviewer", REVISION_ACTION_PERMISSIONS.submit)).toBe(false);
  });
});
