/**
 * Every API handler declares what it needs (lib/http/route.ts), and the
 * declarations are plain data the role × route test can read. The product's
 * own rule (DEVELOPERS.md, "routes"); no external source.
 */
import { describe, expect, it } from "vitest";
import { can, statements, type Permission } from "@/lib/permissions";
import { LIBRARY_ROUTES, routeDeclarations } from "../helpers/route-declarations";

const known = new Set(Object.entries(statements).flatMap(([resource, actions]) => actions.map((a) => `${resource}:${a}`)));

describe("routeDeclarations", () => {
  const all = routeDeclarations();
  const ours = all.filter((h) => !LIBRARY_ROUTES.has(h.route));

  it("finds the handlers of every route file under app/api", () => {
    expect(ours.length).toBeGreaterThan(40);
    expect(ours).toContainEqual({ route: "/api/materials", method: "POST", declared: { kind: "permission", permission: "material:create", brief: false } });
    expect(ours).toContainEqual({ route: "/api/compute", method: "POST", declared: { kind: "permission", permission: "material:read", brief: true } });
    expect(ours).toContainEqual({ route: "/api/health", method: "GET", declared: { kind: "access", access: "public", brief: false } });
  });

  it("returns a declaration made by route() for every handler of ours", () => {
    expect(ours.filter((h) => !h.declared).map((h) => `${h.method} ${h.route}: ${h.problem}`)).toEqual([]);
  });

  it("returns only permissions the roles know, and maps whose every entry is one", () => {
    for (const h of ours) {
      const d = h.declared!;
      const used: Permission[] = d.kind === "permission" ? [d.permission] : d.kind === "by-kind" ? Object.values(d.permissions) : [];
      for (const p of used) {
        expect(known.has(p), `${h.method} ${h.route}: ${p}`).toBe(true);
        // Somebody must be able to call it, or the route is dead.
        expect(["admin", "formulator", "reviewer", "production"].some((role) => can(role, p)), `${h.method} ${h.route}: ${p}`).toBe(true);
      }
    }
  });

  it("reads a permission map named in a route file from lib/permissions.ts", () => {
    const action = ours.find((h) => h.route === "/api/revisions/[id]/[action]")!.declared;
    expect(action).toMatchObject({ kind: "by-kind", mapName: "REVISION_ACTION_PERMISSIONS", permissions: { approve: "formulation:review" } });
    const attachment = ours.find((h) => h.route === "/api/attachments/[id]" && h.method === "DELETE")!.declared;
    expect(attachment).toMatchObject({ kind: "by-kind", permissions: { material: "material:update", batch: "batch:update" } });
  });

  describe("edge cases", () => {
    it("reports the sign-in library's handler as not declared (it is not ours)", () => {
      expect(all.filter((h) => LIBRARY_ROUTES.has(h.route)).map((h) => [h.method, h.declared])).toEqual([
        ["GET", null],
        ["POST", null],
      ]);
    });
  });
});
