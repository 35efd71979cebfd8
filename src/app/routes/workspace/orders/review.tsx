import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { can } from '#shared/permissions.ts';
import { REVIEW_REASONS, type ReviewItem, type ReviewReason } from '#shared/schemas/workspace-orders.ts';
import { formatSize, type LengthUnit } from '#shared/units.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { SelectField, TextAreaField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { PlacedPhoto } from '#src/features/designer/components/placed-photo.tsx';
import { useApprovePhoto, useAskNewPhoto, useReviewQueue } from '#src/features/orders/api/orders.ts';
import { cx } from '#src/lib/cx.ts';

export function ReviewPage() {
  return (
    <WithWorkspace>
      {({ studio, role }) =>
        can(role, 'order:review') ? (
          <Review slug={studio.slug} units={studio.units} />
        ) : (
          <Notice tone="error" title="Not for your role">
            Your role does not include photo review.
          </Notice>
        )
      }
    </WithWorkspace>
  );
}

/** CSS pixels per inch: how browsers map physical size to the screen. */
const CSS_PPI = 96;

function Review({ slug, units }: { slug: string; units: LengthUnit }) {
  const queue = useReviewQueue(slug);
  const [selectedId, setSelectedId] = useState<string>();
  const items = queue.data?.items ?? [];
  const selected = items.find((i) => i.itemId === selectedId) ?? items[0];
  return (
    <div className="flex flex-col gap-6">
      <h1 className="text-3xl font-extrabold">Photo review</h1>
      {queue.error && <Notice tone="error">{queue.error.message}</Notice>}
      {queue.data && items.length === 0 && (
        <Notice>
          No photos are waiting. Paid orders appear here, oldest first; approved ones wait in{' '}
          <Link to={`/studio/${slug}/prep`} className="font-semibold underline">
            Prep
          </Link>
          .
        </Notice>
      )}
      {selected && (
        <div className="grid gap-6 lg:grid-cols-[16rem_minmax(0,1fr)]">
          <nav aria-label="Waiting photos">
            <ol className="flex flex-col gap-2">
              {items.map((item) => (
                <li key={item.itemId}>
                  <button
                    type="button"
                    onClick={() => setSelectedId(item.itemId)}
                    aria-current={item.itemId === selected.itemId}
                    className={cx(
                      'flex w-full items-center gap-3 rounded-lg border p-2 text-left text-sm',
                      item.itemId === selected.itemId ? 'border-ember-500 bg-ember-50' : 'border-graphite-100 bg-white',
                    )}
                  >
                    <img src={item.photo.thumbUrl} alt="" className="size-12 rounded object-cover" />
                    <span>
                      <span className="block font-bold">Order {item.orderNumber}</span>
                      {item.blankName}, {item.sizeLabel}
                      {item.verdict === 'too-low' && <span className="block text-xs font-semibold text-rust-600">Resolution too low</span>}
                    </span>
                  </button>
                </li>
              ))}
            </ol>
          </nav>
          <ReviewDetail key={selected.itemId} slug={slug} units={units} item={selected} last={items.length === 1} />
        </div>
      )}
    </div>
  );
}

function ReviewDetail({ slug, units, item, last }: { slug: string; units: LengthUnit; item: ReviewItem; last: boolean }) {
  const navigate = useNavigate();
  const approve = useApprovePhoto(slug);
  const ask = useAskNewPhoto(slug);
  const toast = useToast();
  const [asking, setAsking] = useState(false);
  const [reason, setReason] = useState<ReviewReason>(
    item.verdict === 'too-low' ? 'low_resolution' : item.photo.quality.blurry ? 'blurry' : 'other',
  );
  const [note, setNote] = useState('');
  const printSize = { width: Math.round((item.areaWidthMm / 25.4) * CSS_PPI), height: Math.round((item.areaHeightMm / 25.4) * CSS_PPI) };
  const centre = {
    x: item.placement.crop.left + item.placement.crop.width / 2,
    y: item.placement.crop.top + item.placement.crop.height / 2,
  };

  async function run(work: () => Promise<unknown>, done: string) {
    try {
      await work();
      toast.show(done, 'success');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  }

  return (
    <div className="flex flex-col gap-6">
      <Card>
        <CardTitle
          aside={
            <Link to={`/studio/${slug}/orders/${item.orderId}`} className="text-sm font-semibold underline">
              Open order {item.orderNumber}
            </Link>
          }
        >
          {item.blankName}, {item.sizeLabel} for {item.buyerName}
        </CardTitle>
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-4">
          <div>
            <dt className="text-graphite-500">At the size</dt>
            <dd
              className={cx(
                'font-bold',
                item.verdict === 'too-low' ? 'text-rust-600' : item.verdict === 'fair' ? 'text-ember-700' : 'text-moss-800',
              )}
            >
              {item.effectivePpi} pixels per inch ({item.verdict === 'too-low' ? 'too low' : item.verdict})
            </dd>
          </div>
          <div>
            <dt className="text-graphite-500">Photo</dt>
            <dd className="font-bold">
              {item.photo.width} × {item.photo.height} px
            </dd>
          </div>
          <div>
            <dt className="text-graphite-500">Sharpness</dt>
            <dd className="font-bold">
              {item.photo.quality.blurry
                ? `looks blurred (${item.photo.quality.sharpness})`
                : `sharp enough (${item.photo.quality.sharpness})`}
            </dd>
          </div>
          <div>
            <dt className="text-graphite-500">Exposure</dt>
            <dd className="font-bold">
              {item.photo.quality.exposure === 'ok'
                ? 'fine'
                : item.photo.quality.exposure === 'dark'
                  ? 'many clipped shadows'
                  : 'many clipped highlights'}
            </dd>
          </div>
        </dl>
        {item.lowResolutionConfirmed && (
          <p className="mt-3 text-sm font-semibold text-rust-600">The buyer confirmed ordering at this size despite the low resolution.</p>
        )}
        {item.inscription && (
          <p className="mt-3 text-sm">
            <span className="font-semibold">Words under the photo: </span>“{item.inscription.lines.join(' / ')}”
          </p>
        )}
        {item.replacements > 0 && <p className="mt-3 text-sm">This is the buyer’s replacement photo number {item.replacements}.</p>}
        <div className="mt-5 flex gap-2">
          <Button
            onClick={() =>
              void run(async () => {
                await approve.mutateAsync({ itemId: item.itemId });
                // The last photo reviewed: the work goes on in Prep.
                if (last) navigate(`/studio/${slug}/prep`);
              }, `Photo approved: order ${item.orderNumber} waits in Prep.`)
            }
          >
            Approve photo
          </Button>
          <Button variant="secondary" onClick={() => setAsking(true)}>
            Ask for a new photo
          </Button>
        </div>
      </Card>
      <div className="grid gap-6 xl:grid-cols-2">
        <Card>
          <CardTitle>At print size ({formatSize(item.areaWidthMm, item.areaHeightMm, units)})</CardTitle>
          <div className="overflow-auto rounded-lg bg-graphite-100 p-3">
            <PlacedPhoto
              photo={item.photo}
              placement={item.placement}
              look={item.look}
              areaWidthMm={item.areaWidthMm}
              size={printSize}
              view="photo"
              label="The photo as placed, at print size, in the blank’s shape"
            />
          </div>
          <p className="mt-2 text-xs text-graphite-500">
            At 96 screen pixels per inch; hold the screen at arm’s length for the look of the real piece.
          </p>
        </Card>
        <Card>
          <CardTitle>At 1:1 (one photo pixel per screen pixel)</CardTitle>
          <div
            role="img"
            aria-label="The centre of the photo at one pixel per pixel"
            className="h-80 w-full rounded border border-graphite-100"
            style={{
              backgroundImage: `url(${item.photo.originalUrl})`,
              backgroundRepeat: 'no-repeat',
              backgroundPosition: `calc(50% - ${centre.x - item.photo.width / 2}px) calc(50% - ${centre.y - item.photo.height / 2}px)`,
            }}
          />
          <p className="mt-2 text-xs text-graphite-500">The centre of the placed photo, from the original file.</p>
        </Card>
      </div>
      <Dialog
        open={asking}
        title="Ask the buyer for a new photo"
        onClose={() => setAsking(false)}
        onSubmit={(e) => {
          e.preventDefault();
          setAsking(false);
          void run(
            () => ask.mutateAsync({ itemId: item.itemId, reason, note }),
            `Asked for a new photo for order ${item.orderNumber}; the buyer has an e-mail with a link.`,
          );
        }}
        confirm={{ label: 'Send the request' }}
      >
        <div className="flex flex-col gap-4">
          <SelectField
            label="Reason"
            options={Object.entries(REVIEW_REASONS).map(([value, label]) => ({ value, label }))}
            value={reason}
            onChange={(e) => setReason(e.target.value as ReviewReason)}
          />
          <TextAreaField
            label="Note to the buyer (optional)"
            value={note}
            onChange={(e) => setNote(e.target.value)}
            maxLength={500}
            hint="Shown in the e-mail, such as what kind of photo would work better."
          />
        </div>
      </Dialog>
    </div>
  );
}
