import { useMemo, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { can } from '#shared/permissions.ts';
import { formatMoney } from '#shared/money.ts';
import { blankInputSchema, type BlankInput, type BlankView, type MaterialView } from '#shared/schemas/catalog.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { DataTable, tableColumns, type DataColumn } from '#src/components/ui/data-table.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import { useBlanks, useCreateBlank, useMaterials } from '#src/features/catalog/api/catalog.ts';
import { BlankFields, blankDefaults, type BlankFormValues } from '#src/features/catalog/components/blank-fields.tsx';
import { CatalogFrame, QueryState } from '#src/features/catalog/components/catalog-frame.tsx';
import { StatusPill } from '#src/features/catalog/components/status-pill.tsx';
import { Swatch } from '#src/features/catalog/components/swatch.tsx';
import { SHAPE_LABELS, statusOptions } from '#src/features/catalog/labels.ts';

export function BlanksPage() {
  return (
    <WithWorkspace>
      {({ studio, role }) => <Blanks slug={studio.slug} currency={studio.currency} canEdit={can(role, 'catalog:write')} />}
    </WithWorkspace>
  );
}

const col = tableColumns<BlankView>();

function Blanks({ slug, currency, canEdit }: { slug: string; currency: string; canEdit: boolean }) {
  const blanks = useBlanks(slug);
  const materials = useMaterials(slug);
  const [creating, setCreating] = useState(false);

  const columns = useMemo<DataColumn<BlankView>[]>(
    () => [
      col.accessor('name', {
        header: 'Blank',
        cell: ({ row }) => {
          const blank = row.original;
          const photo = blank.photos[0];
          return (
            <Link
              to={`/studio/${slug}/catalog/blanks/${blank.id}`}
              className="flex items-center gap-3 font-semibold text-graphite-900 hover:underline"
            >
              {photo ? (
                <img src={photo.url} alt="" className="size-10 rounded-md object-cover" loading="lazy" />
              ) : (
                <Swatch surface={blank.material.surfaceColour} mark={blank.material.markColour} size="size-10" />
              )}
              {blank.name}
            </Link>
          );
        },
      }),
      col.accessor((b) => b.material.name, { id: 'material', header: 'Material' }),
      col.accessor('shape', { header: 'Shape', cell: ({ row }) => SHAPE_LABELS[row.original.shape] }),
      col.accessor('status', {
        header: 'Status',
        filterFn: 'equalsString',
        cell: ({ row }) => <StatusPill status={row.original.status} sizes={row.original.sizes.length} />,
      }),
      col.accessor((b) => b.sizes.length, { id: 'sizes', header: 'Sizes' }),
      col.accessor((b) => b.sizes[0]?.priceMinor ?? -1, {
        id: 'price',
        header: 'From',
        cell: ({ row }) =>
          row.original.sizes[0] ? formatMoney(row.original.sizes[0].priceMinor, currency) : <span className="text-graphite-400">—</span>,
      }),
      col.accessor('sortOrder', { header: 'Position' }),
    ],
    [slug, currency],
  );

  return (
    <CatalogFrame
      slug={slug}
      title="Blanks"
      canEdit={canEdit}
      actions={
        <Button onClick={() => setCreating(true)} disabled={!materials.data}>
          New blank
        </Button>
      }
    >
      <p className="max-w-3xl text-graphite-600">
        The pieces buyers choose from: each made of one material, in one or more sizes with their own price and stock.
      </p>
      <QueryState isPending={blanks.isPending} error={blanks.error} />
      {blanks.data && (
        <DataTable
          caption="Blanks"
          data={blanks.data.blanks}
          columns={columns}
          getRowId={(b) => b.id}
          searchLabel="Search blanks"
          filters={[{ columnId: 'status', label: 'Status', options: statusOptions }]}
          initialSorting={[{ id: 'sortOrder', desc: false }]}
          empty="No blanks yet. Add the first thing your studio sells."
        />
      )}
      {creating && materials.data && <NewBlankDialog slug={slug} materials={materials.data.materials} onClose={() => setCreating(false)} />}
    </CatalogFrame>
  );
}

function NewBlankDialog({ slug, materials, onClose }: { slug: string; materials: MaterialView[]; onClose(): void }) {
  const create = useCreateBlank(slug);
  const toast = useToast();
  const navigate = useNavigate();
  const form = useForm<BlankFormValues, unknown, BlankInput>({
    resolver: zodResolver(blankInputSchema),
    defaultValues: blankDefaults(materials),
  });
  const onSubmit = form.handleSubmit(async (input) => {
    try {
      const blank = await create.mutateAsync(input);
      toast.show(`${blank.name} created. Add its sizes and prices next.`, 'success');
      navigate(`/studio/${slug}/catalog/blanks/${blank.id}`);
    } catch (error) {
      showServerError(form, error);
    }
  });
  return (
    <Dialog
      open
      title="New blank"
      onClose={onClose}
      onSubmit={onSubmit}
      confirm={{ label: 'Create blank', busy: form.formState.isSubmitting }}
      wide
    >
      <div className="flex flex-col gap-4">
        {serverErrorOf(form) && <Notice tone="error">{serverErrorOf(form)}</Notice>}
        <BlankFields form={form} materials={materials} />
      </div>
    </Dialog>
  );
}
