import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { effectivePpi, verdictFor } from '#shared/imaging/photo-checks.ts';
import type { BuyerPhotoView } from '#shared/schemas/photos.ts';
import { formatSize } from '#shared/units.ts';
import { WithStorefront } from '#src/app/layouts/storefront-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { ItemMockup } from '#src/features/designer/components/item-mockup.tsx';
import { PhotoDrop } from '#src/features/designer/components/photo-drop.tsx';
import { PlacedPhoto } from '#src/features/designer/components/placed-photo.tsx';
import { startFraming, toPlacement } from '#src/features/designer/placement.ts';
import { useReplacement, useSendReplacement } from '#src/features/storefront/api/replacement.ts';

/** The buyer's answer to "please send a new photo", by the private link from the e-mail. */
export function ReplacePhotoPage() {
  const { studioSlug = '', token = '' } = useParams();
  const asked = useReplacement(studioSlug, token);
  const [photo, setPhoto] = useState<BuyerPhotoView>();
  const [rights, setRights] = useState(false);
  const send = useSendReplacement(studioSlug, token);

  return (
    <WithStorefront>
      {(studio) => {
        if (asked.isPending) return <p className="text-graphite-500">Opening…</p>;
        if (send.isSuccess)
          return (
            <Notice title="Thank you!">
              {studio.name} has your new photo and will check it. You will hear from us if anything else is needed.
            </Notice>
          );
        if (asked.error)
          return (
            <Notice tone="error" title="This link cannot be used">
              {asked.error.message}
            </Notice>
          );
        const { item } = asked.data;
        const area = { widthMm: item.look.areaWidthMm, heightMm: item.look.areaHeightMm };
        const placement = photo ? toPlacement(photo, area.widthMm / area.heightMm, startFraming(photo)) : undefined;
        const ppi = placement ? effectivePpi(placement.crop, area) : undefined;
        const verdict = ppi === undefined ? undefined : verdictFor(ppi);
        const size = { width: 260, height: Math.round((260 * area.heightMm) / area.widthMm) };
        return (
          <div className="flex flex-col gap-6">
            <h1 className="text-3xl font-extrabold">A new photo for order {asked.data.orderNumber}</h1>
            <Notice tone="caution" title={`Why: ${asked.data.reason}`}>
              {asked.data.note || `${studio.name} checked your photo before engraving and needs another one.`}
            </Notice>
            <div className="grid gap-6 lg:grid-cols-2">
              <Card>
                <CardTitle>
                  {asked.data.blankName}, {asked.data.sizeLabel}
                </CardTitle>
                <p className="mb-3 text-sm text-graphite-600">Your photo now, as it would burn:</p>
                <ItemMockup item={item} width={260} />
              </Card>
              <Card>
                <CardTitle>Your new photo</CardTitle>
                <div className="flex flex-col gap-4">
                  <PhotoDrop studioSlug={studio.slug} hasPhoto={Boolean(photo)} onPhoto={setPhoto} />
                  {photo && placement && (
                    <>
                      <div className="inline-flex self-start rounded-lg bg-graphite-100 p-3">
                        <PlacedPhoto
                          photo={photo}
                          placement={placement}
                          look={item.look}
                          areaWidthMm={item.look.areaWidthMm}
                          size={size}
                          view="burn"
                          label="Your new photo as it will burn"
                        />
                      </div>
                      <p role="status" className={verdict === 'too-low' ? 'font-semibold text-rust-600' : 'font-semibold text-moss-800'}>
                        {verdict === 'too-low' ? 'Still too low' : verdict === 'fair' ? 'Fair' : 'Good'}: {Math.floor(ppi!)} pixels per inch
                        at {formatSize(area.widthMm, area.heightMm, studio.units)}.
                      </p>
                      <label className="flex items-start gap-2 text-sm">
                        <input type="checkbox" checked={rights} onChange={(e) => setRights(e.target.checked)} className="size-6 shrink-0" />
                        I took this photo or have permission to use it.
                      </label>
                      {send.error && <Notice tone="error">{send.error.message}</Notice>}
                      <Button
                        size="lg"
                        disabled={!rights}
                        busy={send.isPending}
                        onClick={() => send.mutate({ photoId: photo.id, placement, rightsConfirmed: true })}
                      >
                        Send this photo
                      </Button>
                    </>
                  )}
                </div>
              </Card>
            </div>
          </div>
        );
      }}
    </WithStorefront>
  );
}
