/** zod schemas of the team routes: teams, members, invitations, the audit trail. */
import { z } from "zod";
import { AUDIT_ACTIONS } from "@/lib/enums";
import { ROLE_NAMES, type RoleName } from "@/lib/permissions";
import { pageParam, pageSizeParam } from "./query";
import { nameField } from "./text";

export const roleSchema = z.enum(ROLE_NAMES as [RoleName, ...RoleName[]]);

export const changeRoleSchema = z.strictObject({ role: roleSchema });

export const inviteSchema = z.strictObject({
  email: z.email("Enter an e-mail address").max(255),
  role: roleSchema,
});

export const createTeamSchema = z.strictObject({ name: nameField(120, "Team name") });

export const auditQuerySchema = z.object({
  entityId: z.string().max(36).optional(),
  entityType: z.string().max(32).optional(),
  actorId: z.string().max(36).optional(),
  action: z.enum(AUDIT_ACTIONS, { error: "action is not one of the recorded events" }).optional(),
  from: z.coerce.date().optional(),
  to: z.coerce.date().optional(),
  page: pageParam,
  pageSize: pageSizeParam(),
});
