import { useState, type FormEvent } from 'react';
import { createInviteInputSchema } from '#shared/schemas/team.ts';
import { can, ROLE_LABELS, ROLES, type Role } from '#shared/permissions.ts';
import type { Member } from '#shared/schemas/team.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { Table, TBody, TD, TH, THActions, THead, TR } from '#src/components/ui/table.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { useChangeRole, useInvite, useRemoveMember, useTeam, useWithdrawInvite } from '#src/features/team/api/team.ts';
import { useFieldErrors } from '#src/lib/use-field-errors.ts';
import { useMe } from '#src/features/auth/api/get-me.ts';

export function TeamPage() {
  return (
    <WithWorkspace>
      {({ studio, role }) =>
        can(role, 'team:manage') ? (
          <Team slug={studio.slug} />
        ) : (
          <Notice tone="error" title="Owners only">
            Your role in this studio does not allow managing the team. Ask an owner.
          </Notice>
        )
      }
    </WithWorkspace>
  );
}

function Team({ slug }: { slug: string }) {
  const team = useTeam(slug);
  const me = useMe();
  const toast = useToast();
  const invite = useInvite(slug);
  const withdraw = useWithdrawInvite(slug);
  const changeRole = useChangeRole(slug);
  const remove = useRemoveMember(slug);
  const form = useFieldErrors();
  const [removing, setRemoving] = useState<Member>();

  async function onInvite(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const element = event.currentTarget;
    const values = form.check(createInviteInputSchema, Object.fromEntries(new FormData(element)));
    if (!values) return;
    try {
      await invite.mutateAsync(values);
      element.reset();
      toast.show(`Invitation sent to ${values.email}.`, 'success');
    } catch (error) {
      form.show(error);
    }
  }

  const onError = (error: unknown) => toast.show((error as Error).message, 'error');

  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Team</h1>
      <Card>
        <CardTitle>Invite someone</CardTitle>
        <form onSubmit={onInvite} className="grid gap-4 sm:grid-cols-[1fr_12rem_auto] sm:items-end" noValidate>
          <TextField label="E-mail address" name="email" type="email" error={form.errors.email} />
          <div className="flex flex-col gap-1.5">
            <label htmlFor="invite-role" className="text-sm font-semibold text-graphite-800">
              Role
            </label>
            <select id="invite-role" name="role" defaultValue="staff" className="h-10 rounded-lg border border-graphite-200 bg-white px-3">
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </select>
          </div>
          <Button type="submit" busy={invite.isPending}>
            Send invitation
          </Button>
        </form>
        {form.formError && (
          <div className="mt-4">
            <Notice tone="error">{form.formError}</Notice>
          </div>
        )}
      </Card>

      {team.error && <Notice tone="error">{team.error.message}</Notice>}
      {team.data && (
        <>
          <section aria-labelledby="members-heading" className="flex flex-col gap-3">
            <h2 id="members-heading" className="text-lg font-bold">
              Members
            </h2>
            <Table>
              <THead>
                <tr>
                  <TH>Name</TH>
                  <TH>E-mail</TH>
                  <TH>Role</TH>
                  <THActions />
                </tr>
              </THead>
              <TBody>
                {team.data.members.map((member) => (
                  <TR key={member.id}>
                    <TD className="font-semibold">
                      {member.name ?? '—'}
                      {member.userId === me.data?.user?.id && <span className="ml-2 text-xs text-graphite-500">(you)</span>}
                    </TD>
                    <TD>{member.email}</TD>
                    <TD>
                      <label className="sr-only" htmlFor={`role-${member.id}`}>
                        Role of {member.name ?? member.email}
                      </label>
                      <select
                        id={`role-${member.id}`}
                        value={member.role}
                        disabled={changeRole.isPending}
                        onChange={(e) =>
                          changeRole.mutate(
                            { memberId: member.id, role: e.target.value as Role },
                            { onError, onSuccess: () => toast.show('Role changed.', 'success') },
                          )
                        }
                        className="h-9 rounded-lg border border-graphite-200 bg-white px-2"
                      >
                        {ROLES.map((r) => (
                          <option key={r} value={r}>
                            {ROLE_LABELS[r]}
                          </option>
                        ))}
                      </select>
                    </TD>
                    <TD className="text-right">
                      <Button variant="quiet" size="sm" onClick={() => setRemoving(member)}>
                        Remove
                      </Button>
                    </TD>
                  </TR>
                ))}
              </TBody>
            </Table>
          </section>

          <section aria-labelledby="invites-heading" className="flex flex-col gap-3">
            <h2 id="invites-heading" className="text-lg font-bold">
              Open invitations
            </h2>
            {team.data.invites.length === 0 ? (
              <p className="text-sm text-graphite-500">No invitation is waiting for an answer.</p>
            ) : (
              <Table>
                <THead>
                  <tr>
                    <TH>E-mail</TH>
                    <TH>Role</TH>
                    <TH>Expires</TH>
                    <THActions />
                  </tr>
                </THead>
                <TBody>
                  {team.data.invites.map((i) => (
                    <TR key={i.id}>
                      <TD>{i.email}</TD>
                      <TD>{ROLE_LABELS[i.role]}</TD>
                      <TD>{new Date(i.expiresAt).toLocaleDateString()}</TD>
                      <TD className="text-right">
                        <Button
                          variant="quiet"
                          size="sm"
                          onClick={() =>
                            withdraw.mutate(i.id, { onError, onSuccess: () => toast.show('Invitation withdrawn.', 'success') })
                          }
                        >
                          Withdraw
                        </Button>
                      </TD>
                    </TR>
                  ))}
                </TBody>
              </Table>
            )}
          </section>
        </>
      )}

      <Dialog
        open={Boolean(removing)}
        title="Remove this member?"
        onClose={() => setRemoving(undefined)}
        confirm={{
          label: 'Remove',
          danger: true,
          busy: remove.isPending,
          onConfirm: () =>
            remove.mutate(removing!.id, {
              onError,
              onSuccess: () => toast.show('Member removed.', 'success'),
              onSettled: () => setRemoving(undefined),
            }),
        }}
      >
        {removing?.name ?? removing?.email} will no longer be able to open this workspace.
      </Dialog>
    </div>
  );
}
