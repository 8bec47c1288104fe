"use client";

import type { ColDef, ICellRendererParams } from "ag-grid-community";
import { useState, useTransition } from "react";
import { DataGrid } from "@/components/grid/data-grid";
import { Button } from "@/components/ui/button";
import { formatDate } from "@/lib/format";
import { ROLE_LABELS, ROLES, type Role } from "@/lib/permissions";
import type { MemberView } from "@/lib/schemas/members";
import { changeRoleAction, removeMemberAction } from "./actions";

interface Props {
  members: MemberView[];
  customers: { id: string; name: string }[];
  selfId: string;
}

export function MembersTable({ members, customers, selfId }: Props) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const run = (action: () => Promise<{ ok: boolean; message?: string }>) =>
    startTransition(async () => {
      const result = await action();
      setMessage(result.ok ? null : (result.message ?? "Could not change the member."));
    });

  const RoleCell = ({ data }: ICellRendererParams<MemberView>) => {
    if (!data) return null;
    return (
      <select
        aria-label={`Role of ${data.name}`}
        className="rounded border border-slate-line bg-white px-1 py-0.5 text-sm"
        value={data.role === "customer" ? `customer:${data.customerId}` : data.role}
        disabled={pending || data.userId === selfId}
        onChange={(e) => {
          const [role, customerId] = e.target.value.split(":") as [Role, string | undefined];
          run(() => changeRoleAction({ userId: data.userId, role, customerId: customerId ?? "" }));
        }}
      >
        {ROLES.filter((r) => r !== "customer").map((r) => (
          <option key={r} value={r}>{ROLE_LABELS[r]}</option>
        ))}
        {customers.map((c) => (
          <option key={c.id} value={`customer:${c.id}`}>Customer · {c.name}</option>
        ))}
      </select>
    );
  };

  const RemoveCell = ({ data }: ICellRendererParams<MemberView>) =>
    data && data.userId !== selfId ? (
      <Button variant="quiet" disabled={pending} onClick={() => confirm(`Remove ${data.name} from this tenant?`) && run(() => removeMemberAction({ userId: data.userId }))}>
        Remove
      </Button>
    ) : null;

  const columns: ColDef<MemberView>[] = [
    { field: "name", headerName: "Name" },
    { field: "email", headerName: "E-mail", minWidth: 200 },
    { field: "role", headerName: "Role", cellRenderer: RoleCell, minWidth: 220, filter: false },
    { field: "joinedAt", headerName: "Member since", valueFormatter: (p) => formatDate(p.value) },
    { headerName: "", cellRenderer: RemoveCell, sortable: false, filter: false, maxWidth: 120 },
  ];
  return (
    <>
      {message ? <p role="alert" className="mb-3 rounded border border-alert/30 bg-alert-wash px-3 py-2 text-sm text-alert">{message}</p> : null}
      <DataGrid label="Members" rows={members} columns={columns} rowId={(m) => m.userId} height={Math.min(520, 60 + members.length * 42)} />
    </>
  );
}
