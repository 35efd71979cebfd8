import { Navigate } from 'react-router-dom';
import { Table, TBody, TD, TH, THActions, THead, TR } from '#src/components/ui/table.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { useMe } from '#src/features/auth/api/get-me.ts';
import { usePlatformStudios, useSetStudioStatus } from '#src/features/platform/api/studios.ts';
import { RequireSignIn } from './workspace/require-sign-in.tsx';

/** Platform admins: every studio with its team size; suspend and resume. */
export function PlatformStudiosPage() {
  return (
    <RequireSignIn>
      <>
        <PlatformStudios />
      </>
    </RequireSignIn>
  );
}

function PlatformStudios() {
  const me = useMe();
  const studios = usePlatformStudios();
  const setStatus = useSetStudioStatus();
  const toast = useToast();
  if (me.data && !me.data.user?.isPlatformAdmin) return <Navigate to="/" replace />;
  return (
    <section className="mx-auto max-w-6xl px-6 py-10">
      <h1 className="mb-6 text-3xl font-extrabold">Studios on the platform</h1>
      {studios.error && <Notice tone="error">{studios.error.message}</Notice>}
      {studios.data && (
        <Table>
          <THead>
            <tr>
              <TH>Studio</TH>
              <TH>Address</TH>
              <TH>Owners</TH>
              <TH>Team members</TH>
              <TH>Opened</TH>
              <TH>Status</TH>
              <THActions />
            </tr>
          </THead>
          <TBody>
            {studios.data.studios.map((s) => (
              <TR key={s.slug}>
                <TD className="font-semibold">{s.name}</TD>
                <TD>/s/{s.slug}</TD>
                <TD>{s.owners}</TD>
                <TD>{s.staff}</TD>
                <TD>{new Date(s.createdAt).toLocaleDateString()}</TD>
                <TD>{s.status === 'active' ? 'Open' : 'Suspended'}</TD>
                <TD className="text-right">
                  <Button
                    size="sm"
                    variant={s.status === 'active' ? 'danger' : 'secondary'}
                    disabled={setStatus.isPending}
                    onClick={() =>
                      setStatus.mutate(
                        { slug: s.slug, action: s.status === 'active' ? 'suspend' : 'resume' },
                        {
                          onError: (e) => toast.show(e.message, 'error'),
                          onSuccess: () => toast.show(`${s.name} is ${s.status === 'active' ? 'suspended' : 'open again'}.`, 'success'),
                        },
                      )
                    }
                  >
                    {s.status === 'active' ? 'Suspend' : 'Resume'}
                  </Button>
                </TD>
              </TR>
            ))}
          </TBody>
        </Table>
      )}
    </section>
  );
}
