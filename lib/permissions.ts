/**
 * Who may do what in a team. Defined once here and checked on the server by
 * every route handler, server action and page (see lib/session.ts).
 *
 * Roles are per membership: one user can be a reviewer in one team and a
 * formulator in another.
 */
import { createAccessControl } from "better-auth/plugins/access";
import { defaultStatements } from "better-auth/plugins/organization/access";
import type { ImportKind } from "./enums";
import type { WorkflowAction } from "./workflow";

export const statements = {
  ...defaultStatements,
  material: ["read", "create", "update", "delete"],
  formulation: ["read", "readUnreleased", "create", "update", "submit", "review", "release", "archive"],
  batch: ["read", "create", "update", "qc", "dispose"],
  lot: ["read", "receive", "update"],
  audit: ["read"],
  mailbox: ["read"],
} as const;

export const ac = createAccessControl(statements);

export const admin = ac.newRole({
  organization: ["update"],
  member: ["create", "update", "delete"],
  invitation: ["create", "cancel"],
  material: ["read", "create", "update", "delete"],
  formulation: ["read", "readUnreleased", "create", "update", "submit", "release", "archive"],
  batch: ["read", "qc", "dispose"],
  lot: ["read", "receive", "update"],
  audit: ["read"],
  mailbox: ["read"],
});

export const formulator = ac.newRole({
  material: ["read", "create", "update"],
  formulation: ["read", "readUnreleased", "create", "update", "submit"],
  batch: ["read"],
  lot: ["read"],
  audit: ["read"],
});

export const reviewer = ac.newRole({
  material: ["read"],
  formulation: ["read", "readUnreleased", "review", "release"],
  batch: ["read", "qc", "dispose"],
  lot: ["read"],
  audit: ["read"],
});

export const production = ac.newRole({
  material: ["read"],
  formulation: ["read"],
  batch: ["read", "create", "update", "qc"],
  lot: ["read", "receive", "update"],
});

export const roles = { admin, formulator, reviewer, production } as const;
export type RoleName = keyof typeof roles;
export const ROLE_NAMES = Object.keys(roles) as RoleName[];

type Statements = typeof statements;
export type Permission = {
  [K in keyof Statements]: `${K & string}:${Statements[K][number]}`;
}[keyof Statements];

/** True when `role` grants `permission` ("resource:action"). */
export function can(role: string | null | undefined, permission: Permission): boolean {
  if (!role || !(role in roles)) return false;
  const [resource, action] = permission.split(":") as [keyof Statements, string];
  const result = roles[role as RoleName].authorize({ [resource]: [action] } as never);
  return result.success;
}

/*
 * Permissions that depend on what a request is about. Each map exists once
 * here; the route layer (lib/http/route.ts) picks the entry once it knows the
 * kind, and the role × route test reads the same maps.
 */

/** Moving a revision through its life, by action (the path's last segment). */
export const REVISION_ACTION_PERMISSIONS = {
  submit: "formulation:submit",
  approve: "formulation:review",
  return: "formulation:review",
  release: "formulation:release",
  archive: "formulation:archive",
} as const satisfies Readonly<Record<WorkflowAction, Permission>>;

/** Reading and changing the documents attached to a material, a batch record or a material lot, by owner type. */
export const ATTACHMENT_PERMISSIONS = {
  read: { material: "material:read", batch: "batch:read", lot: "lot:read" },
  write: { material: "material:update", batch: "batch:update", lot: "lot:update" },
} as const satisfies Readonly<Record<"read" | "write", Readonly<Record<string, Permission>>>>;

/** Importing a spreadsheet creates formulations or materials, by import kind. */
export const IMPORT_PERMISSIONS = {
  formulation: "formulation:create",
  materials: "material:create",
} as const satisfies Readonly<Record<ImportKind, Permission>>;
