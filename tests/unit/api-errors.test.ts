import { describe, expect, it } from "vitest";
import { z } from "zod";
import { isDbUnavailable } from "@/db/errors";
import { ApiError, errorResponse } from "@/lib/http/errors";
import { computeFormulation } from "@/lib/formulation";
import { ApiRequestError, apiErrorFrom } from "@/lib/client/fetcher";

// The error shape and status codes are the product's own API contract (DEVELOPERS.md); no external source.
describe("errorResponse", () => {
  it("returns 422 with every field of a zod error, keyed by dotted path", async () => {
    const schema = z.object({ a: z.object({ b: z.number() }), c: z.string() });
    const res = errorResponse(schema.safeParse({ a: { b: "x" }, c: 1 }).error);
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(body.error.fields).sort()).toEqual(["a.b", "c"]);
  });

  it("returns 422 naming the field of an engine error", async () => {
    let thrown: unknown;
    try {
      computeFormulation({} as never);
    } catch (err) {
      thrown = err;
    }
    const res = errorResponse(thrown);
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(Object.keys(body.error.fields).length).toBeGreaterThan(0);
  });

  it("keeps ApiError statuses and hides unknown errors behind a generic 500", async () => {
    expect(errorResponse(new ApiError(409, "conflict", "stale")).status).toBe(409);
    const hidden = errorResponse(new Error("secret detail at /srv/app.js:1"));
    expect(hidden.status).toBe(500);
    expect(JSON.stringify(await hidden.json())).not.toContain("secret detail");
  });

  describe("edge cases", () => {
    it("answers 503 when MariaDB is unreachable or the connection closed mid-transaction", () => {
      const refused = Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:3307"), { code: "ECONNREFUSED" });
      const closed = new Error("Failed query: rollback", { cause: new Error("Can't add new command when connection is in closed state") });
      const fatal = Object.assign(new Error("Connection lost: The server closed the connection."), { fatal: true });
      for (const err of [refused, closed, fatal]) {
        expect(isDbUnavailable(err)).toBe(true);
        expect(errorResponse(err).status).toBe(503);
      }
      expect(isDbUnavailable(new Error("Duplicate entry"))).toBe(false);
    });
  });
});

// The client side of the same contract: what the pages show for a failed answer.
describe("apiErrorFrom", () => {
  it("keeps the server's code, message and fields", () => {
    const err = apiErrorFrom(422, { error: { code: "invalid_input", message: "name: required", fields: { name: "required" } } });
    expect(err).toBeInstanceOf(ApiRequestError);
    expect([err.status, err.code, err.message, err.fields]).toEqual([422, "invalid_input", "name: required", { name: "required" }]);
  });

  it("says something plain when the answer has no error body (a proxy page, say)", () => {
    expect(apiErrorFrom(401, null).message).toBe("Your session has ended. Sign in again.");
    expect(apiErrorFrom(413, "<html>").message).toBe("The file is too large.");
    const other = apiErrorFrom(502, null);
    expect([other.code, other.message, other.fields]).toEqual(["http_502", "The server answered 502.", {}]);
  });
});

describe("errorResponse and MariaDB's own refusals", () => {
  // mysql2's error fields as MariaDB 10.11 sends them (ER_DUP_ENTRY 1062, ER_DATA_TOO_LONG 1406), wrapped as Drizzle 0.45 wraps a failed query.
  const wrapped = (cause: object) => Object.assign(new Error("Failed query: insert into `materials` …"), { cause });

  it("returns 409 naming material.name for a duplicate material name", async () => {
    const err = wrapped({ code: "ER_DUP_ENTRY", errno: 1062, sqlMessage: "Duplicate entry 'team-1-Ethanol' for key 'materials_team_name_uq'" });
    const res = errorResponse(err);
    expect(res.status).toBe(409);
    const body = (await res.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(body.error.code).toBe("duplicate");
    expect(Object.keys(body.error.fields)).toEqual(["material.name"]);
  });

  it("returns 409 for a duplicate on a key it does not know, without its values", async () => {
    const res = errorResponse(wrapped({ code: "ER_DUP_ENTRY", errno: 1062, sqlMessage: "Duplicate entry 'secret' for key 'other_uq'" }));
    expect(res.status).toBe(409);
    expect(await res.text()).not.toMatch(/secret/);
  });

  it("returns 422 naming the column for a value too long for it", async () => {
    const res = errorResponse(wrapped({ code: "ER_DATA_TOO_LONG", errno: 1406, sqlMessage: "Data too long for column 'name' at row 1" }));
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(body.error.fields)).toEqual(["name"]);
  });
});
