import { useState } from 'react';
import { Link } from 'react-router-dom';
import { ITEM_STAGE_LABELS } from '#shared/orders/stages.ts';
import { prepSettingsSchema, type Cutout, type CutoutStroke, type PrepSettings } from '#shared/schemas/prep.ts';
import { BrushOverlay, CutoutControls, type Brush } from './cutout-brush.tsx';
import { cx } from '#src/lib/cx.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { SelectField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { LaserCautions, methodOptions } from '#src/features/catalog/index.ts';
import { PlacedPhoto } from '#src/features/designer/index.ts';
import { prepMockup } from '../prep-look.ts';
import { useItemAction, useRegionPreview, useStaffItem } from '../api/item.ts';

const PREVIEW_WIDTH = 420;

/** Prep for one item: settings beside a live preview, saved as versions; then a proof or approval. */
export function PrepEditor({
  slug,
  itemId,
  canProduce,
  proofsRequired,
}: {
  slug: string;
  itemId: string;
  canProduce: boolean;
  proofsRequired: boolean;
}) {
  const item = useStaffItem(slug, itemId);
  const [draft, setDraft] = useState<PrepSettings>();
  const [error, setError] = useState<string>();
  const [view, setView] = useState<PreviewView>('after');
  const [brush, setBrush] = useState<Brush>({ mode: 'remove', size: 0.06 });
  const [redo, setRedo] = useState<CutoutStroke[]>([]);
  const [centre, setCentre] = useState({ x: 0.5, y: 0.5 });
  const region = useRegionPreview(slug, itemId);
  const act = useItemAction(slug, itemId);
  if (item.error) return <Notice tone="error">{item.error.message}</Notice>;
  if (!item.data) return <p className="text-graphite-500">Loading…</p>;
  const { item: view_, prep, versions, allowedMoves, orderId, orderNumber } = item.data;
  const settings = draft ?? prep;
  const inPrep = view_.stage === 'prep';
  const size = { width: PREVIEW_WIDTH, height: Math.round((PREVIEW_WIDTH * view_.look.areaHeightMm) / view_.look.areaWidthMm) };
  const mock = prepMockup(view_, settings);
  const set = (change: Partial<PrepSettings>) => setDraft({ ...settings, ...change });
  const editable = inPrep && canProduce;
  const setCutout = (cutout: Cutout) => set({ cutout });
  const addStroke = (stroke: CutoutStroke) => {
    setRedo([]);
    setCutout({ ...settings.cutout, strokes: [...settings.cutout.strokes, stroke] });
  };
  const undo = () => {
    const last = settings.cutout.strokes.at(-1);
    if (!last) return;
    setRedo((r) => [...r, last]);
    setCutout({ ...settings.cutout, strokes: settings.cutout.strokes.slice(0, -1) });
  };
  const redoStroke = () => {
    const next = redo.at(-1);
    if (!next) return;
    setRedo((r) => r.slice(0, -1));
    setCutout({ ...settings.cutout, strokes: [...settings.cutout.strokes, next] });
  };
  const num = (key: keyof PrepSettings, label: string, suffix: string, step = 1) => (
    <TextField
      label={label}
      type="number"
      step={step}
      suffix={suffix}
      value={String(settings[key])}
      disabled={!inPrep || !canProduce}
      onChange={(e) => set({ [key]: Number(e.target.value) } as Partial<PrepSettings>)}
    />
  );

  function save() {
    const parsed = prepSettingsSchema.safeParse(settings);
    if (!parsed.success) return setError(parsed.error.issues.map((i) => `${String(i.path[0])}: ${i.message}`).join(' '));
    setError(undefined);
    act.mutate(
      { path: '/prep', method: 'PUT', body: parsed.data, done: 'Prep settings saved as a new version.' },
      { onSuccess: () => setDraft(undefined) },
    );
  }

  return (
    <div className="flex flex-col gap-6">
      <Link to={`/studio/${slug}/orders/${orderId}`} className="text-sm font-semibold text-graphite-600 hover:underline">
        ← Order {orderNumber}
      </Link>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-3xl font-extrabold">
          {view_.blankName}, {view_.sizeLabel}
        </h1>
        <span className="rounded-full bg-birch-100 px-3 py-1 text-sm font-bold">{ITEM_STAGE_LABELS[view_.stage]}</span>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,34rem)_minmax(0,1fr)]">
        <div className="flex flex-col gap-6">
          <Card>
            <CardTitle aside={<ViewSwitch view={view} onChange={setView} />}>Preview</CardTitle>
            <div className="inline-flex rounded-lg bg-graphite-100 p-3">
              <div className="relative" style={{ width: size.width, height: size.height }}>
                <PlacedPhoto
                  photo={view_.photo}
                  placement={view_.placement}
                  look={mock.look}
                  areaWidthMm={mock.job.areaWidthMm}
                  prep={view === 'before' ? undefined : mock.job.prep}
                  size={size}
                  view={view === 'after' ? 'burn' : 'photo'}
                  label={
                    view === 'before'
                      ? 'The photo before prep'
                      : view === 'cutout'
                        ? 'The cut-out: faded parts are not burned'
                        : 'Preview with these prep settings'
                  }
                />
                {view === 'cutout' && editable && (
                  <BrushOverlay size={size} brush={brush} onStroke={addStroke} label="Paint to keep or remove parts of the photo" />
                )}
                {view === 'after' && (
                  <button
                    type="button"
                    aria-label="Choose where the 1:1 region is"
                    className="absolute inset-0 cursor-cell"
                    onClick={(e) => {
                      const box = e.currentTarget.getBoundingClientRect();
                      setCentre({ x: (e.clientX - box.left) / box.width, y: (e.clientY - box.top) / box.height });
                    }}
                  >
                    <span
                      aria-hidden
                      className="absolute size-5 -translate-x-1/2 -translate-y-1/2 rounded-full border-2 border-white shadow-[0_0_0_1.5px_rgb(0_0_0/0.6)]"
                      style={{ left: `${centre.x * 100}%`, top: `${centre.y * 100}%` }}
                    />
                  </button>
                )}
              </div>
            </div>
            <p className="mt-2 text-sm text-graphite-600">
              {view === 'before' && 'The buyer’s photo as placed, before any prep.'}
              {view === 'cutout' &&
                (editable
                  ? 'Paint with the brush: Keep brings parts back, Remove leaves them unburned. Ctrl+Z undoes.'
                  : 'Faded parts are outside the cut-out and are not burned.')}
              {view === 'after' && 'As it will burn. Click to choose where the 1:1 region below is taken.'}
            </p>
          </Card>
          <Card>
            <CardTitle
              aside={
                <Button size="sm" variant="secondary" busy={region.isPending} onClick={() => region.mutate({ settings, centre })}>
                  Show 1:1 region
                </Button>
              }
            >
              At the machine’s resolution
            </CardTitle>
            {region.error && <Notice tone="error">{region.error.message}</Notice>}
            {region.data ? (
              <figure className="flex flex-col gap-2">
                <img
                  src={region.data.image}
                  alt="A region of the burn, one dot per screen pixel"
                  style={{
                    width: region.data.region.width / (window.devicePixelRatio || 1),
                    imageRendering: 'pixelated',
                    background: view_.look.surfaceColour,
                  }}
                />
                <figcaption className="text-sm text-graphite-600">
                  {region.data.region.width} × {region.data.region.height} dots of {region.data.output.width} × {region.data.output.height}{' '}
                  at {settings.linesPerInch} lines per inch; one dot per screen pixel. Black dots fire the laser.
                </figcaption>
              </figure>
            ) : (
              <p className="text-sm text-graphite-600">
                Makes the burn at full resolution with the settings on this page (saved or not) and shows a {480}-dot square of it.
              </p>
            )}
          </Card>
        </div>
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
            <SelectField
              label="Halftone method"
              options={methodOptions}
              value={settings.halftoneMethod}
              disabled={!inPrep || !canProduce}
              onChange={(e) => set({ halftoneMethod: e.target.value as PrepSettings['halftoneMethod'] })}
            />
            {num('linesPerInch', 'Line density', 'lpi', 1)}
            {num('featherRadius', 'Edge softness', 'px', 1)}
            <label className="flex items-center gap-2 text-sm font-semibold">
              <input
                type="checkbox"
                checked={settings.negative}
                disabled={!inPrep || !canProduce}
                onChange={(e) => set({ negative: e.target.checked })}
              />{' '}
              Negative (the burn is lighter)
            </label>
            <label className="flex items-center gap-2 text-sm font-semibold">
              <input
                type="checkbox"
                checked={settings.autoLevels}
                disabled={!inPrep || !canProduce}
                onChange={(e) => set({ autoLevels: e.target.checked })}
              />{' '}
              Auto levels
            </label>
          </div>
          <h3 className="mt-6 mb-3 font-bold">Cut-out</h3>
          <CutoutControls
            cutout={settings.cutout}
            brush={brush}
            redo={redo.length}
            disabled={!editable}
            onChange={setCutout}
            onBrush={(b) => {
              setBrush(b);
              setView('cutout');
            }}
            onUndo={undo}
            onRedo={redoStroke}
          />
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
              {allowedMoves.includes('proof_sent') && (
                <Button
                  busy={act.isPending && act.variables?.path === '/send-proof'}
                  onClick={() => act.mutate({ path: '/send-proof', done: 'Proof sent; the buyer has an e-mail.' })}
                >
                  Send proof to the buyer
                </Button>
              )}
              {allowedMoves.includes('approved') && view_.stage === 'prep' && !proofsRequired && (
                <Button variant="secondary" onClick={() => act.mutate({ path: '/approve-without-proof', done: 'Approved for engraving.' })}>
                  Approve without a proof
                </Button>
              )}
              {view_.stage === 'changes_requested' && (
                <Button onClick={() => act.mutate({ path: '/reopen-prep', done: 'Back in prep.' })}>Back to prep</Button>
              )}
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

type PreviewView = 'before' | 'cutout' | 'after';
const VIEWS: Array<[PreviewView, string]> = [
  ['before', 'Before'],
  ['cutout', 'Cut-out'],
  ['after', 'After'],
];

function ViewSwitch({ view, onChange }: { view: PreviewView; onChange: (view: PreviewView) => void }) {
  return (
    <div role="radiogroup" aria-label="Preview" className="inline-flex rounded-lg bg-graphite-100 p-0.5 text-sm font-semibold">
      {VIEWS.map(([value, label]) => (
        <button
          key={value}
          type="button"
          role="radio"
          aria-checked={view === value}
          onClick={() => onChange(value)}
          className={cx('rounded-md px-3 py-1', view === value ? 'bg-white shadow-sm' : 'text-graphite-600')}
        >
          {label}
        </button>
      ))}
    </div>
  );
}
