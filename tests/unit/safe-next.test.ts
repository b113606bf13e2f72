/**
 * safeNextPath: where the browser may go after signing in or creating an
 * account. Only paths on our own origin pass; anything a browser would read as
 * another host (a backslash or a second slash after the first, a scheme, tabs
 * and newlines that the URL parser removes) falls back to /home.
 * The cases are the usual open-redirect bypasses (OWASP "Unvalidated Redirects
 * and Forwards Cheat Sheet"; WHATWG URL Standard: "\" is a path separator in
 * http(s) URLs, and tab, LF and CR are removed before parsing).
 */
import { describe, expect, it } from "vitest";
import { safeNextPath } from "@/lib/safe-next";

describe("safeNextPath", () => {
  it("returns a same-origin path with its query and fragment unchanged", () => {
    expect(safeNextPath("/home")).toBe("/home");
    expect(safeNextPath("/formulations?sort=name&dir=asc")).toBe("/formulations?sort=name&dir=asc");
    expect(safeNextPath("/formulations/abc#revisions")).toBe("/formulations/abc#revisions");
    expect(safeNextPath("/invitations/Zx9-_aQ")).toBe("/invitations/Zx9-_aQ");
  });

  it("returns the first value when a query parameter was given twice", () => {
    expect(safeNextPath(["/materials", "//evil.example"])).toBe("/materials");
  });

  it("returns /home for paths that browsers send to another site", () => {
    for (const bad of [
      "/\\evil.example",
      "//evil.example",
      "/\\/evil.example",
      "\\/evil.example",
      "\\\\evil.example",
      "https://evil.example",
      "http:evil.example",
      "HTTPS://evil.example/home",
      "javascript:alert(document.cookie)",
      "JaVaScRiPt:alert(1)",
      "data:text/html,<script>alert(1)</script>",
      "/\t/evil.example",
      "/\n/evil.example",
      "/\r\n/evil.example",
      "\t//evil.example",
      " //evil.example",
      "/\\\tevil.example",
      "/invitations/\\..\\..\\/evil.example",
      "/invitations/../..//evil.example",
      "//evil.example/%2e%2e",
    ]) {
      expect(safeNextPath(bad), JSON.stringify(bad)).toBe("/home");
    }
  });

  it("keeps encoded backslashes and slashes encoded, so they stay inside our path", () => {
    expect(safeNextPath("/%5Cevil.example")).toBe("/%5Cevil.example");
    expect(safeNextPath("/%2F%2Fevil.example")).toBe("/%2F%2Fevil.example");
    expect(safeNextPath("/%5C%5Cevil.example")).toBe("/%5C%5Cevil.example");
  });

  describe("edge cases", () => {
    it("returns the fallback for missing, empty, relative or over-long values", () => {
      expect(safeNextPath(undefined)).toBe("/home");
      expect(safeNextPath(null)).toBe("/home");
      expect(safeNextPath("")).toBe("/home");
      expect(safeNextPath([])).toBe("/home");
      expect(safeNextPath("home")).toBe("/home");
      expect(safeNextPath("evil.example")).toBe("/home");
      expect(safeNextPath(`/${"a".repeat(3000)}`)).toBe("/home");
      expect(safeNextPath("//evil.example", "/create-team")).toBe("/create-team");
    });

    it("resolves dot segments the way the browser will", () => {
      expect(safeNextPath("/materials/../formulations")).toBe("/formulations");
    });

    it("never returns a value that a second parse would send elsewhere", () => {
      for (const value of ["/\\evil.example", "/a/..//\\evil.example", "/.//evil.example", "/%09/evil.example"]) {
        const out = safeNextPath(value);
        expect(new URL(out, "https://gelwright.example").origin, JSON.stringify(value)).toBe("https://gelwright.example");
        expect(out.startsWith("/") && !out.startsWith("//")).toBe(true);
      }
    });
  });
});
