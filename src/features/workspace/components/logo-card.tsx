import { useState } from 'react';
import { useDropzone } from 'react-dropzone';
import { useQueryClient } from '@tanstack/react-query';
import { IMAGE_UPLOAD_TYPES, MAX_IMAGE_UPLOAD_BYTES, uploadTicketSchema } from '#shared/schemas/uploads.ts';
import { AppError } from '#shared/errors.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { apiFetch } from '#src/lib/api-client.ts';
import { cx } from '#src/lib/cx.ts';
import { workspaceQueries, workspaceSchema, type Workspace } from '../api/get-workspace.ts';

/** The studio's logo on its storefront: upload (straight to storage), replace or remove. */
export function LogoCard({ workspace }: { workspace: Workspace }) {
  const slug = workspace.studio.slug;
  const base = `/api/studios/${encodeURIComponent(slug)}/settings`;
  const queryClient = useQueryClient();
  const toast = useToast();
  const [busy, setBusy] = useState(false);

  async function run(work: () => Promise<Workspace>, done: string) {
    setBusy(true);
    try {
      queryClient.setQueryData(workspaceQueries.detail(slug).queryKey, await work());
      await queryClient.invalidateQueries({ queryKey: ['studios'] });
      toast.show(done, 'success');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    } finally {
      setBusy(false);
    }
  }

  const upload = (file: File) =>
    run(async () => {
      const ticket = await apiFetch(`${base}/logo-uploads`, {
        method: 'POST',
        body: { contentType: file.type, contentLength: file.size },
        schema: uploadTicketSchema,
      });
      const put = await fetch(ticket.url, { method: 'PUT', headers: ticket.headers, body: file });
      if (!put.ok) throw new AppError('SERVICE_UNAVAILABLE', `The logo could not be uploaded (${put.status}). Please try again.`);
      return apiFetch(`${base}/logo`, { method: 'PUT', body: { key: ticket.key }, schema: workspaceSchema });
    }, 'Logo saved: it shows on the storefront.');

  const dropzone = useDropzone({
    accept: Object.fromEntries(IMAGE_UPLOAD_TYPES.map((t) => [t, []])),
    maxSize: MAX_IMAGE_UPLOAD_BYTES,
    multiple: false,
    disabled: busy,
    onDrop: (files, rejections) => {
      if (rejections[0]) return toast.show('Use a PNG, JPEG or WebP image up to 25 MB.', 'error');
      if (files[0]) void upload(files[0]);
    },
  });

  return (
    <Card>
      <CardTitle>Logo</CardTitle>
      <div className="flex flex-wrap items-center gap-4">
        {workspace.studio.logoUrl ? (
          <img src={workspace.studio.logoUrl} alt={`${workspace.studio.name} logo`} className="h-16 max-w-48 object-contain" />
        ) : (
          <p className="text-sm text-graphite-500">No logo yet: the storefront shows the studio’s name.</p>
        )}
        <div
          {...dropzone.getRootProps({
            className: cx('cursor-pointer rounded-lg border-2 border-dashed border-graphite-200 px-4 py-3 text-sm', busy && 'opacity-60'),
          })}
        >
          <input {...dropzone.getInputProps({ 'aria-label': 'Choose a logo' })} />
          {busy ? 'Saving…' : 'Drop a logo here or click to choose (PNG with transparency works best)'}
        </div>
        {workspace.studio.logoUrl && (
          <Button
            variant="quiet"
            size="sm"
            disabled={busy}
            onClick={() => void run(() => apiFetch(`${base}/logo`, { method: 'DELETE', schema: workspaceSchema }), 'Logo removed.')}
          >
            Remove logo
          </Button>
        )}
      </div>
    </Card>
  );
}
