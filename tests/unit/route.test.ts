/**
 * The route wrapper (lib/http/route.ts) without a database: the session
 * lookup is replaced, so each test says who is asking. The statuses and the
 * error shape are the product's own API contract (DEVELOPERS.md); no external source.
 */
import { beforeEach, describe, expect, it, vi } from "vitest";
import { ConflictError, ExpiredError, NotFoundError, RuleError } from "@/lib/errors";
import { FormulationError } from "@/lib/formulation/errors";
import { byParam, route, type MemberContext } from "@/lib/http/route";
import { ATTACHMENT_PERMISSIONS, REVISION_ACTION_PERMISSIONS, type RoleName } from "@/lib/permissions";
import type { TeamContext, TeamlessContext } from "@/lib/session";
import { nextState, WorkflowError, type WorkflowAction } from "@/lib/workflow";

const session = vi.hoisted(() => ({
  current: null as TeamContext | TeamlessContext | null,
  full: 0,
  brief: 0,
}));

vi.mock("@/lib/session", () => ({
  getContext: async () => {
    session.full++;
    return session.current;
  },
  getContextBriefly: async () => {
    session.brief++;
    return session.current;
  },
}));

vi.mock("@/lib/settings", () => ({ settings: () => ({ server: { trustedOrigins: new Set(["http://app.test"]) } }) }));

const member = (role: RoleName): TeamContext => ({
  userId: "u-1",
  userName: "Ada Example",
  email: "ada@example.test",
  teamId: "t-1",
  teamName: "Larkspur Lab",
  role,
});
const teamless: TeamlessContext = { userId: "u-2", userName: "New Person", email: "new@example.test", teamId: null };

interface Body {
  error: { code: string; message: string; fields?: Record<string, string> };
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- any route's handler, whatever its params
function call(handler: (req: Request, ctx: { params: Promise<any> }) => Promise<Response>, init: { method?: string; params?: Record<string, string>; origin?: string | null } = {}) {
  const method = init.method ?? "GET";
  const headers = new Headers();
  const origin = init.origin === undefined ? "http://app.test" : init.origin;
  if (origin) headers.set("origin", origin);
  return handler(new Request("http://app.test/api/x", { method, headers }), { params: Promise.resolve(init.params ?? {}) });
}

const ok = vi.fn(async () => Response.json({ ok: true }));

beforeEach(() => {
  session.current = null;
  session.full = 0;
  session.brief = 0;
  ok.mockClear();
});

describe("route() with a declared permission", () => {
  const handler = route({ permission: "material:create" }, ok);

  it("answers 401 with code unauthorized when nobody is signed in, and never calls the handler", async () => {
    const res = await call(handler);
    expect(res.status).toBe(401);
    expect(((await res.json()) as Body).error.code).toBe("unauthorized");
    expect(ok).not.toHaveBeenCalled();
  });

  it("answers 403 to a signed-in person without a team", async () => {
    session.current = teamless;
    const res = await call(handler);
    expect(res.status).toBe(403);
    expect(((await res.json()) as Body).error.message).toBe("Your role in this team does not allow you to use a team's data before joining a team.");
    expect(ok).not.toHaveBeenCalled();
  });

  it("answers 403 naming what is refused to a role that lacks the permission", async () => {
    session.current = member("production");
    const res = await call(handler);
    expect(res.status).toBe(403);
    expect(await res.json()).toEqual({ error: { code: "forbidden", message: "Your role in this team does not allow you to create material." } });
    expect(ok).not.toHaveBeenCalled();
  });

  it("calls the handler once for a role that has it, with the team, the actor and the derived flags", async () => {
    session.current = member("formulator");
    let seen: MemberContext | undefined;
    const res = await call(
      route({ permission: "material:create" }, async (_req, ctx) => {
        seen = ctx;
        return Response.json({ ok: true });
      }),
      { params: { id: "m-1" } },
    );
    expect(res.status).toBe(200);
    expect(seen).toMatchObject({
      params: { id: "m-1" },
      team: { id: "t-1", name: "Larkspur Lab" },
      user: { id: "u-1", name: "Ada Example", email: "ada@example.test" },
      role: "formulator",
      actor: { userId: "u-1", teamId: "t-1" },
      releasedOnly: false,
    });
    expect(seen!.can("material:delete")).toBe(false);
    expect(seen!.can("formulation:submit")).toBe(true);
    expect(session.full).toBe(1);
  });

  it("marks production as seeing released work only", async () => {
    session.current = member("production");
    let releasedOnly: boolean | undefined;
    await call(route({ permission: "formulation:read" }, async (_req, ctx) => ((releasedOnly = ctx.releasedOnly), Response.json({}))));
    expect(releasedOnly).toBe(true);
  });

  it("carries its declaration on the handler", () => {
    expect(handler.declaration).toEqual({ permission: "material:create" });
  });

  describe("edge cases", () => {
    it("refuses a change without our Origin before looking at the session", async () => {
      session.current = member("admin");
      for (const origin of [null, "https://elsewhere.example"]) {
        const res = await call(handler, { method: "POST", origin });
        expect(res.status).toBe(403);
        expect(((await res.json()) as Body).error.code).toBe("bad_origin");
      }
      expect(ok).not.toHaveBeenCalled();
      expect(session.full).toBe(0);
    });

    it("uses the brief session lookup only when declared brief", async () => {
      session.current = member("reviewer");
      expect((await call(route({ permission: "material:read", brief: true }, ok))).status).toBe(200);
      expect([session.brief, session.full]).toEqual([1, 0]);
    });
  });
});

describe("route() with declared access", () => {
  it("lets anyone call a public route without reading a session", async () => {
    expect((await call(route({ access: "public" }, ok))).status).toBe(200);
    expect(session.full + session.brief).toBe(0);
  });

  it("lets a signed-in person without a team call a signed-in route, and tells the handler there is no team", async () => {
    session.current = teamless;
    let team: unknown = "unset";
    const handler = route({ access: "signed-in" }, async (_req, ctx) => ((team = ctx.team), Response.json({})));
    expect((await call(handler)).status).toBe(200);
    expect(team).toBeNull();
    session.current = null;
    expect((await call(handler)).status).toBe(401);
  });

  it("lets every role call a member route, and refuses a person without a team", async () => {
    const handler = route({ access: "member" }, ok);
    for (const role of ["admin", "formulator", "reviewer", "production"] as const) {
      session.current = member(role);
      expect((await call(handler)).status, role).toBe(200);
    }
    session.current = teamless;
    expect((await call(handler)).status).toBe(403);
  });
});

describe("route() with a permission that depends on a path parameter", () => {
  let acted: string | undefined;
  const handler = route<{ id: string; action: string }, { kind: WorkflowAction }>(
    { permission: REVISION_ACTION_PERMISSIONS, subject: byParam<WorkflowAction>("action") },
    async (_req, { subject }) => ((acted = subject.kind), Response.json({})),
  );
  beforeEach(() => {
    acted = undefined;
  });

  it("checks the permission of the action in the path", async () => {
    const status = async (role: RoleName, action: string) => {
      session.current = member(role);
      return (await call(handler, { method: "POST", params: { id: "r-1", action } })).status;
    };
    // REVISION_ACTION_PERMISSIONS: approve needs formulation:review (reviewer only), release formulation:release (admin, reviewer).
    expect(await status("reviewer", "approve")).toBe(200);
    expect(acted).toBe("approve");
    expect(await status("admin", "approve")).toBe(403);
    expect(await status("admin", "release")).toBe(200);
    expect(await status("formulator", "release")).toBe(403);
    expect(await status("formulator", "submit")).toBe(200);
  });

  it("answers 404 for an action that does not exist, after the session check", async () => {
    session.current = member("admin");
    const res = await call(handler, { method: "POST", params: { id: "r-1", action: "explode" } });
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({ error: { code: "not_found", message: "No such action." } });
    expect(acted).toBeUndefined();
    session.current = null;
    expect((await call(handler, { method: "POST", params: { id: "r-1", action: "explode" } })).status).toBe(401);
  });
});

describe("route() with a permission that depends on a stored record's owner", () => {
  const owners: Record<string, "material" | "batch"> = { "a-material": "material", "a-batch": "batch" };
  const stored = async (_req: Request, { params }: MemberContext<{ id: string }>) => {
    const kind = owners[params.id];
    if (!kind) throw new NotFoundError("attachment");
    return { kind, id: params.id };
  };
  const remove = route({ permission: ATTACHMENT_PERMISSIONS.write, subject: stored }, async () => new Response(null, { status: 204 }));

  it("picks the owner's permission once the owner is known", async () => {
    // ATTACHMENT_PERMISSIONS.write: material:update (admin, formulator), batch:update (production).
    const status = async (role: RoleName, id: string) => {
      session.current = member(role);
      return (await call(remove, { method: "DELETE", params: { id } })).status;
    };
    expect(await status("formulator", "a-material")).toBe(204);
    expect(await status("formulator", "a-batch")).toBe(403);
    expect(await status("production", "a-batch")).toBe(204);
    expect(await status("production", "a-material")).toBe(403);
    expect(await status("reviewer", "a-material")).toBe(403);
  });

  it("answers 404 when the subject is not found, whatever the role", async () => {
    session.current = member("reviewer");
    expect((await call(remove, { method: "DELETE", params: { id: "missing" } })).status).toBe(404);
  });
});

describe("route() mapping what a handler throws", () => {
  const throwing = (err: unknown) => {
    session.current = member("admin");
    return call(
      route({ access: "member" }, async () => {
        throw err;
      }),
    );
  };
  const answer = async (err: unknown) => {
    const res = await throwing(err);
    return { status: res.status, body: (await res.json()) as Body };
  };

  it("maps each domain error to its status with its code, message and fields", async () => {
    expect(await answer(new NotFoundError("batch record"))).toEqual({ status: 404, body: { error: { code: "not_found", message: "No such batch record." } } });
    expect(await answer(new ConflictError("conflict", "This batch record is closed.", "notes"))).toEqual({
      status: 409,
      body: { error: { code: "conflict", message: "This batch record is closed.", fields: { notes: "This batch record is closed." } } },
    });
    const rule = await answer(new RuleError("incomplete", "Not yet.", undefined, [{ field: "lines.0.actualGrams", message: "No actual mass." }, { field: "lines.1.lotNumber", message: "No lot number." }]));
    expect(rule).toEqual({
      status: 422,
      body: { error: { code: "incomplete", message: "Not yet.", fields: { "lines.0.actualGrams": "No actual mass.", "lines.1.lotNumber": "No lot number." } } },
    });
    expect((await answer(new ExpiredError("This preview has expired."))).status).toBe(410);
  });

  it("maps the workflow's refusals by class: a wrong state is 409, a broken review rule 422", async () => {
    let wrong: unknown;
    try {
      nextState("draft", "approve");
    } catch (err) {
      wrong = err;
    }
    expect(await answer(wrong)).toMatchObject({ status: 409, body: { error: { code: "wrong_state" } } });
    expect(await answer(new WorkflowError("comment_required", "Say what needs changing.", "comment"))).toEqual({
      status: 422,
      body: { error: { code: "comment_required", message: "Say what needs changing.", fields: { comment: "Say what needs changing." } } },
    });
  });

  it("maps the engine's FormulationError to 422 naming its field", async () => {
    const { status, body } = await answer(new FormulationError("missing_density", "materials.3.density", "Ethanol has no density."));
    expect(status).toBe(422);
    expect(body.error).toEqual({ code: "missing_density", message: "Ethanol has no density.", fields: { "materials.3.density": "Ethanol has no density." } });
  });

  it("maps a mysql2 duplicate-key error (ER_DUP_ENTRY, 1062) to 409 naming the field, without the stored values", async () => {
    // mysql2's fields as MariaDB 10.11 sends them, wrapped as Drizzle wraps a failed query.
    const dup = Object.assign(new Error("Failed query: insert into `formulations` …"), {
      cause: { code: "ER_DUP_ENTRY", errno: 1062, sqlMessage: "Duplicate entry 't-1-Secret name' for key 'formulations_team_name_uq'" },
    });
    const { status, body } = await answer(dup);
    expect(status).toBe(409);
    expect(body.error.code).toBe("duplicate");
    expect(Object.keys(body.error.fields ?? {})).toEqual(["name"]);
    expect(JSON.stringify(body)).not.toContain("Secret name");
  });

  it("maps an unknown error to a generic 500 without its detail", async () => {
    const quiet = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const { status, body } = await answer(new TypeError("cannot read properties of undefined (reading 'secret') at /srv/app/route.js:12"));
    quiet.mockRestore();
    expect(status).toBe(500);
    expect(body).toEqual({ error: { code: "internal", message: "Something went wrong on our side. Nothing was changed." } });
  });
});
