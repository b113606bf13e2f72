"use client";

import { useState } from "react";
import { ROLE_DESCRIPTIONS, ROLE_LABELS, roleLabel } from "@/components/layout/role-words";
import { Button } from "@/components/ui/button";
import { useConfirm } from "@/components/ui/confirm-dialog";
import { ErrorPanel } from "@/components/ui/error-panel";
import { OutcomeMessage, type Outcome } from "@/components/ui/outcome";
import { TableSkeleton } from "@/components/ui/skeleton";
import { TableHead, TD } from "@/components/ui/table-head";
import { errorMessage } from "@/lib/client/fetcher";
import { changeMemberRole, removeMember, useMembers, type Member } from "@/lib/client/team";
import { ROLE_NAMES, type RoleName } from "@/lib/permissions";

interface MembersPanelProps {
  userId: string;
  canManage: boolean;
  canRemove: boolean;
}

/** The team's members; admins change roles and remove members. */
export function MembersPanel({ userId, canManage, canRemove }: MembersPanelProps) {
  const { data, error, isLoading, mutate } = useMembers();
  const [message, setMessage] = useState<Outcome>(null);
  const [confirmDialog, ask] = useConfirm();

  async function changeRole(m: Member, role: RoleName) {
    setMessage(null);
    try {
      await changeMemberRole(m.id, role);
      setMessage({ tone: "info", text: `${m.name} is now ${ROLE_LABELS[role].toLowerCase()}.` });
    } catch (err) {
      setMessage({ tone: "error", text: errorMessage(err) });
    }
    await mutate();
  }

  async function remove(m: Member) {
    const confirmed = await ask({
      title: `Remove ${m.name}?`,
      message: `${m.name} (${m.email}) loses access to the team's formulations, library and batch records at once. Their past work and its history stay.`,
      confirmLabel: "Remove from the team",
    });
    if (!confirmed) return;
    setMessage(null);
    try {
      await removeMember(m.id);
      setMessage({ tone: "info", text: `${m.name} was removed from the team.` });
    } catch (err) {
      setMessage({ tone: "error", text: errorMessage(err) });
    }
    await mutate();
  }

  if (error) return <ErrorPanel message={error.message} onRetry={() => mutate()} />;
  if (isLoading || !data) return <TableSkeleton rows={4} label="Loading members" />;
  return (
    <div className="flex flex-col gap-2">
      {confirmDialog}
      <div className="overflow-x-auto">
        <table className="w-full text-sm">
          <caption className="sr-only">Team members</caption>
          <TableHead columns={["Name", "E-mail", "Role", { label: "Remove", srOnly: true, hidden: !canRemove }]} />
          <tbody>
            {data.rows.map((m) => (
              <tr key={m.id} className="border-b border-rule/60">
                <td className={`${TD} font-medium`}>
                  {m.name}
                  {m.userId === userId ? <span className="ml-1 text-xs text-muted">(you)</span> : null}
                </td>
                <td className={TD}>{m.email}</td>
                <td className={TD}>
                  {canManage ? (
                    <select
                      aria-label={`Role of ${m.name}`}
                      className="rounded border border-rule bg-panel px-1.5 py-1"
                      value={m.role}
                      onChange={(e) => changeRole(m, e.target.value as RoleName)}
                    >
                      {ROLE_NAMES.map((r) => (
                        <option key={r} value={r}>
                          {ROLE_LABELS[r]}
                        </option>
                      ))}
                    </select>
                  ) : (
                    <span title={(ROLE_DESCRIPTIONS as Record<string, string>)[m.role]}>{roleLabel(m.role)}</span>
                  )}
                </td>
                {canRemove ? (
                  <td className={`${TD} text-right`}>
                    {m.userId !== userId ? (
                      <Button variant="ghost" onClick={() => remove(m)} aria-label={`Remove ${m.name}`}>
                        Remove
                      </Button>
                    ) : null}
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <OutcomeMessage outcome={message} />
      <dl className="grid gap-x-3 gap-y-0.5 text-xs text-muted sm:grid-cols-[auto_1fr]">
        {ROLE_NAMES.map((r) => (
          <div key={r} className="contents">
            <dt className="font-medium text-ink">{ROLE_LABELS[r]}</dt>
            <dd>{ROLE_DESCRIPTIONS[r]}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
