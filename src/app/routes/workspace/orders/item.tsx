import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { can } from '../../../../../shared/permissions.ts';
import { ITEM_STAGE_LABELS } from '../../../../../shared/orders/stages.ts';
import { prepSettingsSchema, type PrepSettings } from '../../../../../shared/schemas/prep.ts';
import { staffItemSchema } from '../../../../../shared/schemas/workspace-orders.ts';
import { WorkspaceLayout } from '../../../../components/layouts/workspace-layout.tsx';
import { Button } from '../../../../components/ui/button.tsx';
import { Card, CardTitle } from '../../../../components/ui/card.tsx';
import { SelectField } from '../../../../components/ui/field.tsx';
import { Notice } from '../../../../components/ui/notice.tsx';
import { TextField } from '../../../../components/ui/text-field.tsx';
import { useToast } from '../../../../components/ui/toast.tsx';
import { methodOptions } from '../../../../features/catalog/labels.ts';
import { LaserCautions } from '../../../../features/catalog/components/laser-cautions.tsx';
import { PlacedPhoto } from '../../../../features/designer/components/placed-photo.tsx';
import { prepMockup } from '../../../../features/orders/prep-look.ts';
import { apiFetch } from '../../../../lib/api-client.ts';

export function StaffItemPage() {
  const { itemId = '' } = useParams();
  return <WorkspaceLayout>{({ studio, role, orders }) => <StaffItem slug={studio.slug} itemId={itemId} canProduce={can(role, 'order:produce')} proofsRequired={orders.proofsRequired} />}</WorkspaceLayout>;
}

const PREVIEW_WIDTH = 420;

/** Prep for one item: settings beside a live preview, saved as versions; then a proof or approval. */
function StaffItem({ slug, itemId, canProduce, proofsRequired }: { slug: string; itemId: string; canProduce: boolean; proofsRequired: boolean }) {
  const url = `/api/studios/${encodeURIComponent(slug)}/items/${itemId}`;
  const queryClient = useQueryClient();
  const toast = useToast();
  const item = useQuery({ queryKey: ['orders', slug, 'item', itemId], queryFn: ({ signal }) => apiFetch(url, { schema: staffItemSchema, signal }) });
  const [draft, setDraft] = useState<PrepSettings>();
  const [error, setError] = useState<string>();
  const act = useMutation({
    mutationFn: ({ path, method = 'POST', body }: { path: string; method?: 'POST' | 'PUT'; body?: unknown; done: string }) => apiFetch(`${url}${path}`, { method, body }),
    onSuccess: (_r, { done }) => toast.show(done, 'success'),
    onError: (e) => toast.show((e as Error).message, 'error'),
    onSettled: () => queryClient.invalidateQueries({ queryKey: ['orders', slug] }),
  });
  if (item.error) return <Notice tone="error">{item.error.message}</Notice>;
  if (!item.data) return <p className="text-graphite-500">Loading…</p>;
  const { item: view, prep, versions, allowedMoves, orderId, orderNumber } = item.data;
  const settings = draft ?? prep;
  const inPrep = view.stage === 'prep';
  const size = { width: PREVIEW_WIDTH, height: Math.round((PREVIEW_WIDTH * view.look.areaHeightMm) / view.look.areaWidthMm) };
  const mock = prepMockup(view, settings, PREVIEW_WIDTH);
  const set = (change: Partial<PrepSettings>) => setDraft({ ...settings, ...change });
  const num = (key: keyof PrepSettings, label: string, suffix: string, step = 1) => (
    <TextField label={label} type="number" step={step} suffix={suffix} value={String(settings[key])} disabled={!inPrep || !canProduce} onChange={(e) => set({ [key]: Number(e.target.value) } as Partial<PrepSettings>)} />
  );

  function save() {
    const parsed = prepSettingsSchema.safeParse(settings);
    if (!parsed.success) return setError(parsed.error.issues.map((i) => `${String(i.path[0])}: ${i.message}`).join(' '));
    setError(undefined);
    act.mutate({ path: '/prep', method: 'PUT', body: parsed.data, done: 'Prep settings saved as a new version.' }, { onSuccess: () => setDraft(undefined) });
  }

  return (
    <div className="flex flex-col gap-6">
      <Link to={`/studio/${slug}/orders/${orderId}`} className="text-sm font-semibold text-graphite-600 hover:underline">
        ← Order {orderNumber}
      </Link>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-3xl font-extrabold">
          {view.blankName}, {view.sizeLabel}
        </h1>
        <span className="rounded-full bg-birch-100 px-3 py-1 text-sm font-bold">{ITEM_STAGE_LABELS[view.stage]}</span>
      </div>
      <div className="grid gap-6 lg:grid-cols-[auto_minmax(0,1fr)]">
        <Card>
          <CardTitle>As it will burn</CardTitle>
          <div className="inline-flex rounded-lg p-3" style={{ background: view.look.surfaceColour }}>
            <PlacedPhoto photo={view.photo} placement={view.placement} look={mock.look} prep={mock.job} size={size} view="burn" label="Preview with these prep settings" />
          </div>
        </Card>
        <Card>
          <CardTitle>Prep settings</CardTitle>
          {!inPrep && <Notice>Settings can be changed while the item is being prepared.</Notice>}
          <div className="mt-3 grid gap-4 sm:grid-cols-3">
            {num('brightness', 'Brightness', '', 1)}
            {num('contrast', 'Contrast', '', 1)}
            {num('gamma', 'Gamma', '', 0.05)}
            {num('sharpenAmount', 'Sharpen amount', '%', 10)}
            {num('sharpenRadius', 'Sharpen radius', 'px', 0.1)}
            {num('sharpenThreshold', 'Sharpen threshold', '', 1)}
            <SelectField label="Halftone method" options={methodOptions} value={settings.halftoneMethod} disabled={!inPrep || !canProduce} onChange={(e) => set({ halftoneMethod: e.target.value as PrepSettings['halftoneMethod'] })} />
            {num('linesPerInch', 'Line density', 'lpi', 1)}
            {num('featherRadius', 'Edge softness', 'px', 1)}
            <label className="flex items-center gap-2 text-sm font-semibold">
              <input type="checkbox" checked={settings.negative} disabled={!inPrep || !canProduce} onChange={(e) => set({ negative: e.target.checked })} /> Negative (the burn is lighter)
            </label>
            <label className="flex items-center gap-2 text-sm font-semibold">
              <input type="checkbox" checked={settings.autoLevels} disabled={!inPrep || !canProduce} onChange={(e) => set({ autoLevels: e.target.checked })} /> Auto levels
            </label>
          </div>
          {error && (
            <div className="mt-3">
              <Notice tone="error">{error}</Notice>
            </div>
          )}
          {canProduce && (
            <div className="mt-5 flex flex-wrap gap-2">
              {inPrep && (
                <Button onClick={save} busy={act.isPending} variant="secondary">
                  Save settings
                </Button>
              )}
              {allowedMoves.includes('proof_sent') && <Button onClick={() => act.mutate({ path: '/send-proof', done: 'Proof sent; the buyer has an e-mail.' })}>Send proof to the buyer</Button>}
              {allowedMoves.includes('approved') && view.stage === 'prep' && !proofsRequired && (
                <Button variant="secondary" onClick={() => act.mutate({ path: '/approve-without-proof', done: 'Approved for engraving.' })}>
                  Approve without a proof
                </Button>
              )}
              {view.stage === 'changes_requested' && <Button onClick={() => act.mutate({ path: '/reopen-prep', done: 'Back in prep.' })}>Back to prep</Button>}
            </div>
          )}
          {versions.length > 0 && (
            <details className="mt-4 text-sm">
              <summary className="cursor-pointer font-semibold">Saved versions ({versions.length})</summary>
              <ol className="mt-2 flex flex-col gap-1">
                {versions.map((v) => (
                  <li key={v.version}>
                    Version {v.version} by {v.savedBy}, {new Date(v.savedAt).toLocaleString()}
                  </li>
                ))}
              </ol>
            </details>
          )}
        </Card>
      </div>
      <LaserCautions />
    </div>
  );
}
