"use client";

import { createColumnHelper, type ColumnDef } from "@tanstack/react-table";
import { useActionState } from "react";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { inputClasses } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import { ROLES, ROLE_LABELS, type Role } from "@/lib/domain/permissions";
import type { ActionState } from "@/lib/validation/action-state";

export interface UserRow {
  id: string;
  email: string;
  name: string;
  role: Role;
  status: "invited" | "active" | "disabled";
  sites: { id: number; code: string; name: string }[];
}

type FormAction = (prev: ActionState, form: FormData) => Promise<ActionState>;

export interface UsersTableProps {
  users: UserRow[];
  sites: { id: number; code: string; name: string }[];
  currentUserId: string;
  actions: { changeRole: FormAction; setSites: FormAction; disable: FormAction; enable: FormAction };
}

const STATUS: Record<UserRow["status"], { icon: string; label: string; classes: string }> = {
  active: { icon: "●", label: "Active", classes: "text-good" },
  invited: { icon: "✉", label: "Invited", classes: "text-caution" },
  disabled: { icon: "⊘", label: "Disabled", classes: "text-bad" },
};

const helper = createColumnHelper<UserRow>();

export function UsersTable({ users, sites, currentUserId, actions }: UsersTableProps) {
  const columns = [
    helper.accessor("name", { header: "Name", cell: (c) => <span className="font-bold">{c.getValue()}</span> }),
    helper.accessor("email", { header: "E-mail" }),
    helper.accessor("role", {
      header: "Role",
      filterFn: "equals",
      cell: (c) =>
        c.row.original.id === currentUserId ? (
          ROLE_LABELS[c.getValue()]
        ) : (
          <RoleForm user={c.row.original} action={actions.changeRole} />
        ),
    }),
    helper.accessor((u) => u.sites.map((s) => s.code).join(" "), {
      id: "sites",
      header: "Sites",
      cell: (c) => <SitesForm user={c.row.original} sites={sites} action={actions.setSites} />,
    }),
    helper.accessor("status", {
      header: "Status",
      filterFn: "equals",
      cell: (c) => {
        const s = STATUS[c.getValue()];
        return (
          <span className={`inline-flex items-center gap-1 font-bold ${s.classes}`}>
            <span aria-hidden="true">{s.icon}</span>
            {s.label}
          </span>
        );
      },
    }),
    helper.display({
      id: "actions",
      header: "Account",
      cell: (c) =>
        c.row.original.id === currentUserId ? (
          <span className="text-2xs text-ink-faint">you</span>
        ) : (
          <DisableForm user={c.row.original} disable={actions.disable} enable={actions.enable} />
        ),
    }),
  ] as ColumnDef<UserRow, unknown>[];

  return (
    <DataTable
      data={users}
      columns={columns}
      caption="Users"
      filterLabel="Find a person"
      facets={[
        { columnId: "role", label: "Role", options: ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] })) },
        {
          columnId: "status",
          label: "Status",
          options: (["active", "invited", "disabled"] as const).map((s) => ({ value: s, label: STATUS[s].label })),
        },
      ]}
      rowTestId={(u) => `user-row-${u.email}`}
      empty={
        <EmptyState title="No one matches">
          <p>Clear the filter, or invite the person with the form beside the table.</p>
        </EmptyState>
      }
    />
  );
}

function Result({ state }: { state: ActionState }) {
  if (state.status === "idle") return null;
  const ok = state.status === "success";
  const message = state.message ?? (state.status === "invalid" ? Object.values(state.fieldErrors).flat().join(" ") : "");
  return (
    <p role="status" className={`text-2xs ${ok ? "text-good" : "text-bad"}`}>
      <span aria-hidden="true">{ok ? "✔ " : "✖ "}</span>
      {message}
    </p>
  );
}

function RoleForm({ user, action }: { user: UserRow; action: FormAction }) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  return (
    <form action={formAction} className="flex flex-wrap items-center gap-1">
      <input type="hidden" name="userId" value={user.id} />
      <label className="sr-only" htmlFor={`role-${user.id}`}>
        Role of {user.name}
      </label>
      <select id={`role-${user.id}`} name="role" defaultValue={user.role} className={`${inputClasses} w-auto py-1`}>
        {ROLES.map((role) => (
          <option key={role} value={role}>
            {ROLE_LABELS[role]}
          </option>
        ))}
      </select>
      <SubmitButton variant="secondary" pendingLabel="…" aria-label={`Save role of ${user.name}`}>
        Save
      </SubmitButton>
      <Result state={state} />
    </form>
  );
}

function SitesForm({ user, sites, action }: { user: UserRow; sites: UsersTableProps["sites"]; action: FormAction }) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  const has = new Set(user.sites.map((s) => s.id));
  return (
    <details>
      <summary className="cursor-pointer">{user.sites.length ? user.sites.map((s) => s.code).join(", ") : "none"}</summary>
      <form action={formAction} className="mt-2 flex flex-col gap-1">
        <input type="hidden" name="userId" value={user.id} />
        {sites.map((site) => (
          <label key={site.id} className="flex items-center gap-2">
            <input type="checkbox" name="siteIds" value={site.id} defaultChecked={has.has(site.id)} className="h-4 w-4" />
            {site.name}
          </label>
        ))}
        <SubmitButton variant="secondary" pendingLabel="…">
          Save sites
        </SubmitButton>
        <Result state={state} />
      </form>
    </details>
  );
}

function DisableForm({ user, disable, enable }: { user: UserRow; disable: FormAction; enable: FormAction }) {
  const disabled = user.status === "disabled";
  const [state, formAction] = useActionState(disabled ? enable : disable, { status: "idle" });
  return (
    <form action={formAction}>
      <input type="hidden" name="userId" value={user.id} />
      <SubmitButton variant={disabled ? "secondary" : "danger"} pendingLabel="…" aria-label={`${disabled ? "Enable" : "Disable"} ${user.name}`}>
        {disabled ? "Enable" : "Disable"}
      </SubmitButton>
      <Result state={state} />
    </form>
  );
}
