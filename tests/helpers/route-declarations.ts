/**
 * Reads what every API route declares (lib/http/route.ts) from the route
 * files themselves, without loading them: `export const GET = route({ … }, …)`
 * is parsed with the TypeScript compiler, and a permission map named there
 * (REVISION_ACTION_PERMISSIONS, ATTACHMENT_PERMISSIONS.read, …) is looked up
 * in lib/permissions.ts. The role × route test derives its expectations from
 * these declarations.
 */
import { readdirSync, readFileSync } from "node:fs";
import { join, relative, sep } from "node:path";
import ts from "typescript";
import * as permissions from "@/lib/permissions";
import type { Permission } from "@/lib/permissions";

export const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type Method = (typeof METHODS)[number];

export type Declared =
  | { kind: "access"; access: "public" | "signed-in" | "member"; brief: boolean }
  | { kind: "permission"; permission: Permission; brief: boolean }
  | { kind: "by-kind"; permissions: Readonly<Record<string, Permission>>; mapName: string };

export interface DeclaredHandler {
  /** The route file's pattern under app/, e.g. "/api/revisions/[id]". */
  route: string;
  method: Method;
  /** The declaration, or null when the handler is not made by route() with a literal declaration. */
  declared: Declared | null;
  /** Why `declared` is null. */
  problem?: string;
}

/** Route files that are not ours to declare: the sign-in library's own handler. */
export const LIBRARY_ROUTES = new Set(["/api/auth/[...all]"]);

function lookUp(expr: ts.Expression, file: string): unknown {
  const path: string[] = [];
  let e: ts.Expression = expr;
  while (ts.isPropertyAccessExpression(e)) {
    path.unshift(e.name.text);
    e = e.expression;
  }
  if (!ts.isIdentifier(e)) throw new Error(`${file}: a declaration refers to ${expr.getText()}, which is not a name from lib/permissions.ts`);
  path.unshift(e.text);
  let value: unknown = permissions;
  for (const key of path) {
    value = (value as Record<string, unknown> | undefined)?.[key];
  }
  if (value === undefined) throw new Error(`${file}: ${path.join(".")} is not exported by lib/permissions.ts`);
  return value;
}

function readDeclaration(arg: ts.Expression | undefined, file: string): Declared | string {
  if (!arg || !ts.isObjectLiteralExpression(arg)) return "its first argument is not an object literal";
  const props = new Map<string, ts.Expression>();
  for (const p of arg.properties) {
    if (!ts.isPropertyAssignment(p) && !ts.isShorthandPropertyAssignment(p)) return `it has a property that is not plain data: ${p.getText()}`;
    const value = ts.isPropertyAssignment(p) ? p.initializer : p.name;
    props.set(p.name.getText(), value);
  }
  const brief = props.get("brief")?.kind === ts.SyntaxKind.TrueKeyword;
  const access = props.get("access");
  if (access) {
    if (!ts.isStringLiteral(access) || !["public", "signed-in", "member"].includes(access.text)) return `access is not "public", "signed-in" or "member"`;
    return { kind: "access", access: access.text as "public" | "signed-in" | "member", brief };
  }
  const permission = props.get("permission");
  if (!permission) return "it declares neither access nor permission";
  if (ts.isStringLiteral(permission)) return { kind: "permission", permission: permission.text as Permission, brief };
  if (!props.has("subject")) return "a permission map needs a subject";
  return { kind: "by-kind", permissions: lookUp(permission, file) as Record<string, Permission>, mapName: permission.getText() };
}

/** Every exported handler of every route file under app/api, with what it declares. */
export function routeDeclarations(root = join(process.cwd(), "app")): DeclaredHandler[] {
  const out: DeclaredHandler[] = [];
  const walk = (dir: string) => {
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      const full = join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (entry.name === "route.ts") out.push(...readRouteFile(full, "/" + relative(root, dir).split(sep).filter((seg) => !/^\(.*\)$/.test(seg)).join("/")));
    }
  };
  walk(join(root, "api"));
  return out.sort((a, b) => `${a.route} ${a.method}`.localeCompare(`${b.route} ${b.method}`));
}

function readRouteFile(file: string, route: string): DeclaredHandler[] {
  const source = ts.createSourceFile(file, readFileSync(file, "utf8"), ts.ScriptTarget.Latest, true);
  const out: DeclaredHandler[] = [];
  const isMethod = (name: string): name is Method => (METHODS as readonly string[]).includes(name);
  for (const statement of source.statements) {
    const exported = ts.canHaveModifiers(statement) && ts.getModifiers(statement)?.some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
    if (!exported) continue;
    if (ts.isFunctionDeclaration(statement) && statement.name && isMethod(statement.name.text)) {
      out.push({ route, method: statement.name.text, declared: null, problem: "a plain function, not made by route()" });
    }
    if (!ts.isVariableStatement(statement)) continue;
    for (const decl of statement.declarationList.declarations) {
      if (ts.isObjectBindingPattern(decl.name)) {
        for (const el of decl.name.elements) {
          if (isMethod(el.name.getText())) out.push({ route, method: el.name.getText() as Method, declared: null, problem: "destructured, not made by route()" });
        }
        continue;
      }
      const name = decl.name.getText();
      if (!isMethod(name)) continue;
      const init = decl.initializer;
      if (!init || !ts.isCallExpression(init) || init.expression.getText() !== "route") {
        out.push({ route, method: name, declared: null, problem: "not made by route()" });
        continue;
      }
      const declared = readDeclaration(init.arguments[0], file);
      out.push(typeof declared === "string" ? { route, method: name, declared: null, problem: declared } : { route, method: name, declared });
    }
  }
  return out;
}
