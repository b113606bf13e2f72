"use client";

import { useState } from "react";
import useSWR from "swr";
import { ROLE_DESCRIPTIONS, ROLE_LABELS } from "@/components/layout/role-words";
import { Button } from "@/components/ui/button";
import { useConfirm } from "@/components/ui/confirm-dialog";
import { ErrorPanel } from "@/components/ui/error-panel";
import { TableSkeleton } from "@/components/ui/skeleton";
import { apiSend, errorMessage, fetcher } from "@/lib/client/fetcher";
import { ROLE_NAMES, type RoleName } from "@/lib/permissions";

interface Member {
  id: string;
  userId: string;
  role: RoleName;
  name: string;
  email: string;
}

interface MembersPanelProps {
  userId: string;
  canManage: boolean;
  canRemove: boolean;
}

/** The team's members; admins change roles and remove members. */
export function MembersPanel({ userId, canManage, canRemove }: MembersPanelProps) {
  const { data, error, isLoading, mutate } = useSWR<{ rows: Member[] }>("/api/members", fetcher);
  const [message, setMessage] = useState<{ tone: "error" | "info"; text: string } | null>(null);
  const [confirmDialog, ask] = useConfirm();

  async function changeRole(m: Member, role: RoleName) {
    setMessage(null);
    try {
      await apiSend("PATCH", `/api/members/${m.id}`, { role });
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
      await apiSend("DELETE", `/api/members/${m.id}`);
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
          <thead>
            <tr className="border-b border-rule text-left text-xs text-muted">
              <th scope="col" className="px-2 py-1">
                Name
              </th>
              <th scope="col" className="px-2 py-1">
                E-mail
              </th>
              <th scope="col" className="px-2 py-1">
                Role
              </th>
              {canRemove ? (
                <th scope="col" className="px-2 py-1">
                  <span className="sr-only">Remove</span>
                </th>
              ) : null}
            </tr>
          </thead>
          <tbody>
            {data.rows.map((m) => (
              <tr key={m.id} className="border-b border-rule/60">
                <td className="px-2 py-1.5 font-medium">
                  {m.name}
                  {m.userId === userId ? <span className="ml-1 text-xs text-muted">(you)</span> : null}
                </td>
                <td className="px-2 py-1.5">{m.email}</td>
                <td className="px-2 py-1.5">
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
                    <span title={ROLE_DESCRIPTIONS[m.role]}>{ROLE_LABELS[m.role] ?? m.role}</span>
                  )}
                </td>
                {canRemove ? (
                  <td className="px-2 py-1.5 text-right">
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
      <p aria-live="polite" role={message?.tone === "error" ? "alert" : undefined} className={`text-sm ${message?.tone === "error" ? "text-fail" : "text-clear"}`}>
        {message?.text}
      </p>
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
