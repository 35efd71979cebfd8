import { useState } from 'react';
import { Link } from 'react-router-dom';
import { can } from '#shared/permissions.ts';
import { AUDIT_ACTION_LABELS, AUDIT_GROUPS, type AuditGroup } from '#shared/schemas/audit.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { SelectField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { Table, TBody, TD, TH, THead, TR } from '#src/components/ui/table.tsx';
import { useAuditLog } from '#src/features/audit/api/audit.ts';

export function AuditLogPage() {
  return (
    <WithWorkspace>
      {({ studio, role }) =>
        can(role, 'audit:read') ? (
          <AuditLog slug={studio.slug} />
        ) : (
          <Notice tone="info" title="Owners only">
            The audit log shows refunds, team changes, prices and downloads of buyers’ photos. Ask an owner of the studio.
          </Notice>
        )
      }
    </WithWorkspace>
  );
}

const when = (iso: string) => new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** Sensitive things done in the studio, newest first: who, when, to what, and what changed. */
function AuditLog({ slug }: { slug: string }) {
  const [group, setGroup] = useState<AuditGroup | undefined>();
  const log = useAuditLog(slug, group);
  const entries = log.data?.pages.flatMap((p) => p.entries) ?? [];

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-3xl font-extrabold">Audit log</h1>
          <p className="mt-1 max-w-2xl text-graphite-600">
            Refunds and cancellations, team and role changes, price and recipe changes, and every time a member opened a buyer’s original
            photo or downloaded a render. Lines are written with the change itself and cannot be edited.
          </p>
        </div>
        <SelectField
          label="Show"
          placeholder="Everything"
          options={(Object.keys(AUDIT_GROUPS) as AuditGroup[]).map((g) => ({ value: g, label: AUDIT_GROUPS[g] }))}
          value={group ?? ''}
          onChange={(e) => setGroup((e.target.value || undefined) as AuditGroup | undefined)}
          className="w-64"
        />
      </div>
      {log.error && <Notice tone="error">{log.error.message}</Notice>}
      {log.isPending && <p className="text-graphite-500">Loading the audit log…</p>}
      {log.data && entries.length === 0 && (
        <p className="text-center text-graphite-500">Nothing recorded{group ? ' of this kind' : ''} yet.</p>
      )}
      {entries.length > 0 && (
        <Table>
          <THead>
            <tr>
              <TH>When</TH>
              <TH>Who</TH>
              <TH>What</TH>
              <TH>Concerning</TH>
              <TH>Details</TH>
            </tr>
          </THead>
          <TBody>
            {entries.map((e) => (
              <TR key={e.id}>
                <TD className="whitespace-nowrap text-graphite-600">
                  <time dateTime={e.at}>{when(e.at)}</time>
                </TD>
                <TD className="whitespace-nowrap font-semibold">{e.actor}</TD>
                <TD className="whitespace-nowrap">{AUDIT_ACTION_LABELS[e.action]}</TD>
                <TD>
                  {e.link ? (
                    <Link to={e.link} className="font-semibold hover:underline">
                      {e.subject}
                    </Link>
                  ) : (
                    e.subject
                  )}
                </TD>
                <TD className="text-graphite-700">{e.summary}</TD>
              </TR>
            ))}
          </TBody>
        </Table>
      )}
      {log.hasNextPage && (
        <div className="flex justify-center">
          <Button variant="secondary" onClick={() => void log.fetchNextPage()} disabled={log.isFetchingNextPage}>
            {log.isFetchingNextPage ? 'Loading…' : 'Show older'}
          </Button>
        </div>
      )}
    </div>
  );
}
