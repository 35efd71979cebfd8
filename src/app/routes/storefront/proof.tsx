import { useState } from 'react';
import { useParams } from 'react-router-dom';
import { WithStorefront } from '#src/app/layouts/storefront-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { TextAreaField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useAnswerProof, useProof } from '#src/features/storefront/api/proof.ts';

/** The buyer's proof: how the piece will burn, to approve or to ask for changes (the link works once). */
export function ProofPage() {
  const { studioSlug = '', token = '' } = useParams();
  const proof = useProof(studioSlug, token);
  const [message, setMessage] = useState('');
  const [confirming, setConfirming] = useState(false);
  const answer = useAnswerProof(studioSlug, token);
  return (
    <WithStorefront>
      {(studio) => {
        if (answer.isSuccess)
          return (
            <Notice title="Thank you!">
              {(answer.variables as { decision: string }).decision === 'approve'
                ? `${studio.name} will engrave it as shown.`
                : `${studio.name} has your note and will send a new proof.`}
            </Notice>
          );
        if (proof.isPending) return <p className="text-graphite-500">Opening your proof…</p>;
        if (proof.error)
          return (
            <Notice tone="error" title="This proof cannot be opened">
              {proof.error.message}
            </Notice>
          );
        const { item, orderNumber, imageUrl } = proof.data;
        const width = 420;
        return (
          <div className="flex flex-col gap-6">
            <h1 className="text-3xl font-extrabold">Your proof for order {orderNumber}</h1>
            <div className="grid gap-6 lg:grid-cols-[auto_minmax(0,1fr)]">
              <Card>
                <CardTitle>
                  {item.blankName}, {item.sizeLabel}
                </CardTitle>
                <div className="inline-flex rounded-lg bg-graphite-100 p-3">
                  <img
                    src={imageUrl}
                    alt="Your proof, as it will burn"
                    width={width}
                    height={Math.round((width * item.look.areaHeightMm) / item.look.areaWidthMm)}
                    className="max-w-full"
                  />
                </div>
                <p className="mt-2 text-xs text-graphite-500">The dots are drawn at screen size; the laser burns them far finer.</p>
              </Card>
              <Card>
                <CardTitle>Is it right?</CardTitle>
                <div className="flex flex-col gap-4">
                  {answer.error && <Notice tone="error">{answer.error.message}</Notice>}
                  {/* Engraving cannot be undone: approving asks once more. */}
                  {confirming ? (
                    <div
                      role="group"
                      aria-label="Confirm the approval"
                      className="flex flex-col gap-3 rounded-lg border border-accent bg-birch-50 p-4"
                    >
                      <p className="text-sm font-semibold">The studio will engrave exactly what the proof shows. Go ahead?</p>
                      <div className="flex flex-wrap gap-3">
                        <Button size="lg" busy={answer.isPending} onClick={() => answer.mutate({ decision: 'approve' })}>
                          Yes, engrave it as shown
                        </Button>
                        <Button size="lg" variant="secondary" onClick={() => setConfirming(false)}>
                          Not yet
                        </Button>
                      </div>
                    </div>
                  ) : (
                    <Button size="lg" onClick={() => setConfirming(true)}>
                      Approve and engrave
                    </Button>
                  )}
                  <TextAreaField
                    label="Or tell us what to change"
                    value={message}
                    onChange={(e) => setMessage(e.target.value)}
                    maxLength={1000}
                  />
                  <Button
                    variant="secondary"
                    disabled={!message.trim()}
                    busy={answer.isPending}
                    onClick={() => answer.mutate({ decision: 'changes', message })}
                  >
                    Ask for changes
                  </Button>
                </div>
              </Card>
            </div>
          </div>
        );
      }}
    </WithStorefront>
  );
}
