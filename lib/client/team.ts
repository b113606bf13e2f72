import useSWR from "swr";
import type { CapturedMail } from "@/lib/mailbox";
import type { listInvitations, listMembers } from "@/db/queries/members";
import type { RoleName } from "@/lib/permissions";
import { apiSend, fetcher } from "./fetcher";
import type { ApiData } from "./json";

/** A member of the team, as GET /api/members sends it. */
export type Member = ApiData<typeof listMembers>[number];
/** An invitation of the team, as GET /api/invitations sends it. */
export type Invitation = ApiData<typeof listInvitations>[number];
/** A mail the local mail catcher kept for the team. */
export type Mail = CapturedMail;

/** The team's members (any member may see who is in the team). */
export function useMembers() {
  return useSWR<{ rows: Member[] }>("/api/members", fetcher);
}

/** Changes a member's role (admins only; the team always keeps an admin). */
export function changeMemberRole(memberId: string, role: RoleName) {
  return apiSend("PATCH", `/api/members/${memberId}`, { role });
}

/** Removes a member from the team. */
export function removeMember(memberId: string) {
  return apiSend("DELETE", `/api/members/${memberId}`);
}

/** The team's invitations, pending and past. */
export function useInvitations() {
  return useSWR<{ rows: Invitation[] }>("/api/invitations", fetcher);
}

/** Invites someone by e-mail with a role. */
export function invite(body: { email: string; role: RoleName }) {
  return apiSend("POST", "/api/invitations", body);
}

/** Creates a team with the signed-in person as its admin. */
export function createTeam(name: string) {
  return apiSend("POST", "/api/teams", { name });
}

/** Mail about the team's business that the local mail catcher kept, refreshed every 10 s. */
export function useMailbox() {
  return useSWR<{ rows: Mail[] }>("/api/mailbox", fetcher, { refreshInterval: 10_000 });
}
