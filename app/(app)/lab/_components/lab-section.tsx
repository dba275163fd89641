"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { ErrorPanel } from "@/components/ui/error-panel";
import { SkeletonRows } from "@/components/ui/skeleton";
import { INPUT_CLASS } from "@/components/ui/text-field";
import { describeError } from "@/lib/query/fetcher";
import { useChangeMemberRole, useLabMembers, useRemoveMember } from "@/lib/query/labs";
import { roleAtLeast, type LabRole, LAB_ROLES } from "@/lib/contracts/roles";
import type { LabSummary, MemberSummary } from "@/lib/contracts/labs";
import { LoadMore } from "@/components/ui/load-more";
import { InvitationsPanel } from "./invitations-panel";
import { ROLE_LABEL, ROLE_MEANING } from "@/lib/contracts/roles";
import { noun } from "@/lib/text/plural";

export function LabSection({ lab, currentUserId }: { lab: LabSummary; currentUserId: string }) {
  const members = useLabMembers(lab.id);
  const isOwner = roleAtLeast(lab.role, "owner");
  const changeRole = useChangeMemberRole(lab.id);
  const remove = useRemoveMember(lab.id);
  const [removing, setRemoving] = useState<MemberSummary | null>(null);
  // A role change takes effect at once for the member, so it is confirmed first.
  const [roleChange, setRoleChange] = useState<{ member: MemberSummary; role: LabRole } | null>(null);
  const headingId = `lab-${lab.id}`;

  return (
    <section aria-labelledby={headingId}>
      <h2 id={headingId} className="text-lg font-semibold">
        {lab.name}
      </h2>
      <p className="text-sm text-ink-soft">
        Your role: {ROLE_LABEL[lab.role]} ({ROLE_MEANING[lab.role]}).
      </p>

      {changeRole.isError ? (
        <p role="alert" className="mt-3 rounded-md border border-ember bg-ember-light px-4 py-2 text-sm">
          Role not changed: {describeError(changeRole.error)}
        </p>
      ) : null}

      <div className="mt-4">
        {members.isPending ? (
          <SkeletonRows label={`Loading members of ${lab.name}`} rows={3} />
        ) : members.isError ? (
          <ErrorPanel error={members.error} retry={() => void members.refetch()} />
        ) : (
          <div className="relative overflow-x-auto rounded-lg border border-ink/10 bg-paper-raised">
            <table className="w-full text-sm">
              <caption className="sr-only">Members of {lab.name}</caption>
              <thead className="border-b border-ink/10 bg-paper-sunk/70">
                <tr>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    Name
                  </th>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    E-mail
                  </th>
                  <th scope="col" className="px-3 py-2 text-left font-semibold">
                    Role
                  </th>
                  {isOwner ? (
                    <th scope="col" className="px-3 py-2 text-left font-semibold">
                      <span className="sr-only">Actions</span>
                    </th>
                  ) : null}
                </tr>
              </thead>
              <tbody className="divide-y divide-ink/10">
                {members.data.map((member) => (
                  <tr key={member.userId}>
                    <td className="px-3 py-2">
                      {member.name}
                      {member.userId === currentUserId ? <span className="ml-1 text-ink-soft">(you)</span> : null}
                    </td>
                    <td className="px-3 py-2 text-ink-soft">{member.email}</td>
                    <td className="px-3 py-2">
                      {isOwner ? (
                        <>
                          <label htmlFor={`role-${lab.id}-${member.userId}`} className="sr-only">
                            Role of {member.name}
                          </label>
                          <div className="w-32">
                            <select
                              id={`role-${lab.id}-${member.userId}`}
                              value={
                                changeRole.isPending && changeRole.variables.userId === member.userId
                                  ? changeRole.variables.role
                                  : member.role
                              }
                              disabled={changeRole.isPending}
                              onChange={(event) => {
                                changeRole.reset();
                                setRoleChange({ member, role: event.target.value as LabRole });
                              }}
                              className={`${INPUT_CLASS} py-1`}
                            >
                              {LAB_ROLES.map((role) => (
                                <option key={role} value={role}>
                                  {ROLE_LABEL[role]}
                                </option>
                              ))}
                            </select>
                          </div>
                        </>
                      ) : (
                        ROLE_LABEL[member.role]
                      )}
                    </td>
                    {isOwner ? (
                      <td className="px-3 py-2 text-right">
                        <Button
                          variant="danger"
                          className="py-1"
                          onClick={() => {
                            remove.reset();
                            setRemoving(member);
                          }}
                        >
                          Remove<span className="sr-only"> {member.name}</span>
                        </Button>
                      </td>
                    ) : null}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </div>

      {members.isSuccess ? (
        <LoadMore
          shown={members.data.length}
          hasMore={members.hasNextPage}
          loading={members.isFetchingNextPage}
          onMore={() => void members.fetchNextPage()}
          noun={noun("member")}
        />
      ) : null}
      {isOwner ? <InvitationsPanel labId={lab.id} labName={lab.name} /> : null}

      <ConfirmDialog
        open={removing !== null}
        title={`Remove ${removing?.name ?? ""} from ${lab.name}?`}
        confirmLabel="Remove member"
        destructive
        pending={remove.isPending}
        error={remove.isError ? describeError(remove.error) : null}
        onCancel={() => setRemoving(null)}
        onConfirm={() => {
          if (removing) remove.mutate(removing.userId, { onSuccess: () => setRemoving(null) });
        }}
      >
        They lose access to the lab&apos;s parameter sets at once. Their earlier versions keep their name.
      </ConfirmDialog>

      <ConfirmDialog
        open={roleChange !== null}
        title={roleChange ? `Make ${roleChange.member.name} ${ROLE_LABEL[roleChange.role].toLowerCase()} of ${lab.name}?` : ""}
        confirmLabel="Change role"
        destructive={
          roleChange !== null && roleAtLeast(roleChange.member.role, roleChange.role) && roleChange.member.role !== roleChange.role
        }
        pending={changeRole.isPending}
        error={changeRole.isError ? describeError(changeRole.error) : null}
        onCancel={() => setRoleChange(null)}
        onConfirm={() => {
          if (roleChange)
            changeRole.mutate({ userId: roleChange.member.userId, role: roleChange.role }, { onSuccess: () => setRoleChange(null) });
        }}
      >
        {roleChange
          ? `From ${ROLE_LABEL[roleChange.member.role].toLowerCase()} (${ROLE_MEANING[roleChange.member.role]}) ` +
            `to ${ROLE_LABEL[roleChange.role].toLowerCase()} (${ROLE_MEANING[roleChange.role]}). It takes effect at once.`
          : null}
      </ConfirmDialog>
    </section>
  );
}
