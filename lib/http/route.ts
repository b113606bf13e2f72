/**
 * The route layer: every handler under app/api is made by `route()`, which
 * takes a declaration of what the route needs and checks it once, before
 * the handler runs:
 *
 *   route({ permission: "material:read" }, handler)         a member whose role grants it
 *   route({ access: "member" }, handler)                     any member of a team
 *   route({ access: "signed-in" }, handler)                  signed in, with or without a team
 *   route({ access: "public" }, handler)                     anyone (the health check)
 *   route({ permission: MAP, subject: resolve }, handler)    the permission depends on what the
 *                                                            request is about: `resolve` finds its
 *                                                            kind, MAP[kind] is checked
 *   { …, brief: true }                                       a checked session is trusted for 30 s
 *                                                            (routes that touch no stored data)
 *
 * 401 when not signed in, 403 without a team or when the role lacks the
 * permission; a change must come from our own Origin; every error becomes
 * the one JSON error shape (lib/http/errors.ts). Each handler carries its
 * declaration (`handler.declaration`), and tests/helpers/route-declarations.ts
 * reads them from the route files for the role × route test.
 */
import "server-only";
import { settings } from "@/lib/settings";
import { NotFoundError } from "@/lib/errors";
import { can, type Permission, type RoleName } from "@/lib/permissions";
import { getContext, getContextBriefly, type TeamContext } from "@/lib/session";
import { ApiError, errorResponse, forbidden, unauthorized } from "./errors";

export type Params = Record<string, string>;

/** What a route's handler is told about the caller who passed its declaration. */
export interface MemberContext<P = Params> {
  params: P;
  user: { id: string; name: string; email: string };
  team: { id: string; name: string };
  role: RoleName;
  /** The caller as the queries take it: { userId, teamId }. */
  actor: { userId: string; teamId: string };
  /** True for roles that see released work only (they lack formulation:readUnreleased): production. */
  releasedOnly: boolean;
  can: (permission: Permission) => boolean;
}

export interface SubjectContext<P, S> extends MemberContext<P> {
  /** What the request is about, as the declaration's `subject` found it. */
  subject: S;
}

export interface SignedInContext<P = Params> {
  params: P;
  user: { id: string; name: string; email: string };
  /** The caller's current team, or null before they join one. */
  team: { id: string; name: string } | null;
}

export interface PublicContext<P = Params> {
  params: P;
}

/**
 * Finds what a request is about (its `kind` picks the permission); runs after
 * the caller is known to be a member. `what` names the kind in the 404 for a
 * kind the map does not have ("No such action.").
 */
export type SubjectResolver<P, S extends { kind: string }> = ((req: Request, ctx: MemberContext<P>) => Promise<S> | S) & { what?: string };

export type RouteDeclaration =
  | { access: "public" }
  | { access: "signed-in" }
  | { access: "member"; brief?: boolean }
  | { permission: Permission; brief?: boolean }
  | { permission: Readonly<Record<string, Permission>>; subject: SubjectResolver<never, { kind: string }> };

interface NextContext<P> {
  params: Promise<P>;
}

/** A route handler as Next.js calls it, with the declaration it was made from. */
export type RouteHandler<P> = ((req: Request, ctx: NextContext<P>) => Promise<Response>) & { readonly declaration: RouteDeclaration };

type Handler<C> = (req: Request, ctx: C) => Promise<Response>;

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Cross-site request check for changes, as the HTTP front makes it too (a
 * second line for a handler reached some other way): a browser always sends
 * Origin on a POST/PUT/PATCH/DELETE, and it must be one of ours; a change
 * without one is refused. (Cookies are SameSite=Lax as well.)
 */
function assertSameOrigin(req: Request): void {
  if (SAFE_METHODS.has(req.method)) return;
  const origin = req.headers.get("origin");
  if (!origin || !settings().server.trustedOrigins.has(origin)) {
    throw new ApiError(
      403,
      "bad_origin",
      origin ? "This request came from another site and was refused." : "Changes are accepted only from Gelwright's own pages (the request had no Origin header).",
    );
  }
}

/** The words after "Your role in this team does not allow you to …". */
function describe(permission: Permission): string {
  const [resource, action] = permission.split(":");
  const words: Record<string, string> = {
    readUnreleased: "see work that is not released",
    review: "review revisions",
  };
  return words[action ?? ""] ?? `${action} ${resource === "formulation" ? "formulations" : resource}`;
}

function memberContext<P>(ctx: TeamContext, params: P): MemberContext<P> {
  return {
    params,
    user: { id: ctx.userId, name: ctx.userName, email: ctx.email },
    team: { id: ctx.teamId, name: ctx.teamName },
    role: ctx.role,
    actor: { userId: ctx.userId, teamId: ctx.teamId },
    releasedOnly: !can(ctx.role, "formulation:readUnreleased"),
    can: (permission) => can(ctx.role, permission),
  };
}

/** Checks the declaration against the request and builds the handler's context; throws 401/403/404. */
async function authorize(decl: RouteDeclaration, req: Request, params: Params): Promise<unknown> {
  if ("access" in decl && decl.access === "public") return { params };
  const brief = "brief" in decl && decl.brief === true;
  const found = brief ? await getContextBriefly(req.headers) : await getContext(req.headers);
  if (!found) throw unauthorized();
  if ("access" in decl && decl.access === "signed-in") {
    const user = { id: found.userId, name: found.userName, email: found.email };
    return { params, user, team: found.teamId ? { id: found.teamId, name: found.teamName } : null } satisfies SignedInContext;
  }
  if (!found.teamId) throw forbidden("use a team's data before joining a team");
  const member = memberContext(found, params);
  if (!("permission" in decl)) return member;
  if (typeof decl.permission === "string") {
    if (!member.can(decl.permission)) throw forbidden(describe(decl.permission));
    return member;
  }
  const subject = await (decl.subject as SubjectResolver<Params, { kind: string }>)(req, member);
  const needed = Object.hasOwn(decl.permission, subject.kind) ? decl.permission[subject.kind] : undefined;
  if (!needed) throw new NotFoundError(decl.subject.what);
  if (!member.can(needed)) throw forbidden(describe(needed));
  return { ...member, subject };
}

/** Anyone may call it; no session is read. */
export function route<P = Params>(decl: { access: "public" }, handler: Handler<PublicContext<P>>): RouteHandler<P>;
/** A signed-in caller, with or without a team (401 otherwise). */
export function route<P = Params>(decl: { access: "signed-in" }, handler: Handler<SignedInContext<P>>): RouteHandler<P>;
/** A member of a team (401 signed out, 403 without a team), whose role grants `permission` if one is declared (403 otherwise). */
export function route<P = Params>(
  decl: { access: "member"; brief?: boolean } | { permission: Permission; brief?: boolean },
  handler: Handler<MemberContext<P>>,
): RouteHandler<P>;
/** A member whose role grants `permission[kind]`, the kind of what `subject` finds the request is about (404 for a kind not in the map). */
export function route<P, S extends { kind: string }>(
  decl: { permission: Readonly<Record<S["kind"], Permission>>; subject: SubjectResolver<P, S> },
  handler: Handler<SubjectContext<P, S>>,
): RouteHandler<P>;
export function route(decl: RouteDeclaration, handler: Handler<never>): RouteHandler<Params> {
  const wrapped = async (req: Request, ctx: NextContext<Params>): Promise<Response> => {
    try {
      assertSameOrigin(req);
      const context = await authorize(decl, req, (await ctx?.params) ?? {});
      return await handler(req, context as never);
    } catch (err) {
      return errorResponse(err);
    }
  };
  return Object.assign(wrapped, { declaration: decl });
}

/**
 * A subject resolver for a permission chosen by a path parameter, e.g. the
 * action in /api/revisions/:id/:action; the wrapper answers 404 ("No such
 * action.") for a value the permission map does not have.
 *
 * @example
 * ```ts
 * route({ permission: REVISION_ACTION_PERMISSIONS, subject: byParam("action") }, handler);
 * ```
 */
export function byParam<K extends string>(name: string): SubjectResolver<Params, { kind: K }> {
  return Object.assign((_req: Request, ctx: MemberContext) => ({ kind: (ctx.params[name] ?? "") as K }), { what: name });
}
