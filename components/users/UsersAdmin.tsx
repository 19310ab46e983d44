"use client";

import useSWR from "swr";
import { useMemo, useState } from "react";
import { DataTable, type DataColumn } from "@/components/DataTable";
import { swrFetcher, patchJson } from "@/lib/client/fetch-json";
import { ROLE_LABEL, ROLES, type Role } from "@/lib/auth/permissions";
import type { UserDTO } from "@/lib/contracts/users";
import { NewUserForm } from "./NewUserForm";
import { useDateStyle } from "@/components/SiteFormat";
import { formatDateTime, type DateStyle } from "@/lib/format/dates";

const when = (iso: string | null, style: DateStyle) => (iso ? formatDateTime(iso, style) : "never");

export function UsersAdmin({ myId }: { myId: string }) {
  const { data, error, isLoading, mutate } = useSWR<{ users: UserDTO[] }>("/api/users", swrFetcher);
  const [message, setMessage] = useState<{ kind: "error" | "info"; text: string } | null>(null);
  const style = useDateStyle();

  const columns = useMemo<DataColumn<UserDTO>[]>(() => {
    async function change(user: UserDTO, patch: { role?: Role; disabled?: boolean }, done: string) {
      const r = await patchJson<{ user: UserDTO }>(`/api/users/${user.id}`, { version: user.version, ...patch });
      setMessage(r.ok ? { kind: "info", text: done } : { kind: "error", text: r.message });
      await mutate();
    }
    return [
      { accessorKey: "displayName", header: "Name" },
      { accessorKey: "email", header: "E-mail" },
      {
        accessorKey: "role",
        header: "Role",
        cell: ({ row }) => {
          const u = row.original;
          return (
            <select
              aria-label={`Role of ${u.displayName}`}
              className="field min-w-40"
              value={u.role}
              disabled={u.id === myId}
              title={u.id === myId ? "You cannot change your own role" : undefined}
              onChange={(e) =>
                change(
                  u,
                  { role: e.target.value as Role },
                  `${u.displayName} is now ${ROLE_LABEL[e.target.value as Role].toLowerCase()}; their sessions were ended.`,
                )
              }
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABEL[r]}
                </option>
              ))}
            </select>
          );
        },
      },
      {
        id: "status",
        accessorFn: (u) => (u.disabled ? "Disabled" : "Active"),
        header: "Status",
        cell: ({ getValue }) => {
          const v = String(getValue());
          return (
            <span className={v === "Disabled" ? "font-semibold text-alarm" : "font-semibold text-trail-dark"}>
              {v === "Disabled" ? "✕ Disabled" : "✓ Active"}
            </span>
          );
        },
      },
      {
        id: "lastSignIn",
        accessorFn: (u) => u.lastSignInAt ?? "",
        header: "Last sign-in",
        cell: ({ row }) => when(row.original.lastSignInAt, style),
      },
      {
        id: "actions",
        header: "Actions",
        enableSorting: false,
        cell: ({ row }) => {
          const u = row.original;
          if (u.id === myId) return <span className="text-sm text-ink-soft">This is you</span>;
          return u.disabled ? (
            <button
              type="button"
              className="btn-quiet"
              onClick={() => change(u, { disabled: false }, `${u.displayName} can sign in again.`)}
            >
              Enable
            </button>
          ) : (
            <button
              type="button"
              className="btn-danger"
              onClick={() => change(u, { disabled: true }, `${u.displayName} is disabled and signed out.`)}
            >
              Disable
            </button>
          );
        },
      },
    ];
  }, [mutate, myId, style]);

  return (
    <div className="space-y-6">
      {message && (
        <div
          role={message.kind === "error" ? "alert" : "status"}
          className={message.kind === "error" ? "notice-error" : "notice-info"}
        >
          {message.text}
        </div>
      )}
      {error ? (
        <div role="alert" className="notice-error">
          Could not load the users: {(error as Error).message}
        </div>
      ) : isLoading || !data ? (
        <p className="text-ink-soft">Loading users…</p>
      ) : (
        <DataTable
          data={data.users}
          columns={columns}
          rowId={(u) => u.id}
          searchLabel="name, e-mail or role"
          empty="No users yet."
        />
      )}
      <NewUserForm
        onCreated={async (u) => {
          setMessage({ kind: "info", text: `Added ${u.displayName} (${u.email}).` });
          await mutate();
        }}
      />
    </div>
  );
}
