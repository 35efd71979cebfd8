import { Link, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { Button } from '#src/components/ui/button.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { signOutEverywhere } from '#src/features/auth/api/sign-in.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { TodayPanel } from '#src/features/orders/components/today.tsx';
import { can } from '#shared/permissions.ts';

const roleText = {
  owner: 'As an owner you manage the team, the catalog, prices and refunds, and everything on orders.',
  staff: 'As a team member you work on orders: review photos, prepare them, send proofs, burn and ship.',
} as const;

export function WorkspaceOverviewPage() {
  return (
    <WithWorkspace>
      {({ studio, role }) => (
        <div className="flex flex-col gap-6">
          <h1 className="text-3xl font-extrabold">{studio.name}</h1>
          {studio.status === 'suspended' && (
            <Notice tone="caution" title="This studio is suspended">
              The storefront is closed to new orders. Contact the platform team to reopen it.
            </Notice>
          )}
          {can(role, 'order:read') && <TodayPanel slug={studio.slug} />}
          <div className="grid gap-4 md:grid-cols-2">
            <Card>
              <CardTitle>Your role</CardTitle>
              <p className="text-graphite-700">{roleText[role]}</p>
              <SignOutEverywhere />
            </Card>
            <Card>
              <CardTitle>Storefront</CardTitle>
              <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
                <dt className="font-semibold text-graphite-600">Address</dt>
                <dd>
                  <Link to={`/s/${studio.slug}`} className="font-semibold text-ember-700 underline">
                    /s/{studio.slug}
                  </Link>
                </dd>
                <dt className="font-semibold text-graphite-600">Currency</dt>
                <dd>{studio.currency}</dd>
                <dt className="font-semibold text-graphite-600">Sizes shown in</dt>
                <dd>{studio.units === 'in' ? 'inches' : 'millimetres'}</dd>
                <dt className="font-semibold text-graphite-600">Contact</dt>
                <dd>{studio.contactEmail ?? '—'}</dd>
              </dl>
            </Card>
          </div>
          <Notice tone="caution" title="Laser safety">
            Never leave a running laser unattended, keep fire suppression at hand, run fume extraction and wear eye protection rated for the
            wavelength. Never burn PVC or vinyl. Follow your machine maker’s manual and local codes.
          </Notice>
        </div>
      )}
    </WithWorkspace>
  );
}

/** Ends every session of this account, on every device (a lost phone, a shared computer). */
function SignOutEverywhere() {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const toast = useToast();
  return (
    <div className="mt-4 border-t border-graphite-100 pt-4">
      <Button
        variant="secondary"
        size="sm"
        onClick={async () => {
          try {
            await signOutEverywhere();
            queryClient.clear();
            navigate('/sign-in');
          } catch (error) {
            toast.show((error as Error).message, 'error');
          }
        }}
      >
        Sign out on every device
      </Button>
    </div>
  );
}
