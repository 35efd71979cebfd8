import { useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { can } from '#shared/permissions.ts';
import { formatMoney } from '#shared/money.ts';
import {
  blankInputSchema,
  type BlankInput,
  type BlankStatus,
  type BlankView,
  type MaterialView,
  type SizeView,
} from '#shared/schemas/catalog.ts';
import { formatSize, type LengthUnit } from '#shared/units.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { DataTable, tableColumns, type DataColumn } from '#src/components/ui/data-table.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import { useBlank, useMaterials, useRecipes, useRemoveSize, useUpdateBlank } from '#src/features/catalog/api/catalog.ts';
import { BlankFields, type BlankFormValues } from '#src/features/catalog/components/blank-fields.tsx';
import { RowActions, useConfirmedDelete } from '#src/features/catalog/components/row-actions.tsx';
import { CatalogFrame, QueryState } from '#src/features/catalog/components/catalog-frame.tsx';
import { PhotoPanel } from '#src/features/catalog/components/photo-panel.tsx';
import { SizeDialog } from '#src/features/catalog/components/size-dialog.tsx';
import { StatusPill } from '#src/features/catalog/components/status-pill.tsx';
import { ORIENTATION_LABELS } from '#src/features/catalog/labels.ts';

export function BlankPage() {
  const { blankId = '' } = useParams();
  return (
    <WithWorkspace>
      {({ studio, role }) => (
        <Blank slug={studio.slug} blankId={blankId} units={studio.units} currency={studio.currency} canEdit={can(role, 'catalog:write')} />
      )}
    </WithWorkspace>
  );
}

type Props = { slug: string; blankId: string; units: LengthUnit; currency: string; canEdit: boolean };

function Blank(props: Props) {
  const blank = useBlank(props.slug, props.blankId);
  const materials = useMaterials(props.slug);
  return (
    <CatalogFrame
      slug={props.slug}
      title={blank.data?.name ?? 'Blank'}
      canEdit={props.canEdit}
      actions={blank.data && <StatusActions {...props} blank={blank.data} />}
    >
      <Link to={`/studio/${props.slug}/catalog/blanks`} className="-mt-4 text-sm font-semibold text-graphite-600 hover:underline">
        ← All blanks
      </Link>
      <QueryState isPending={blank.isPending || materials.isPending} error={blank.error ?? materials.error} />
      {blank.data && materials.data && <BlankDetail {...props} blank={blank.data} materials={materials.data.materials} />}
    </CatalogFrame>
  );
}

const toInput = (blank: BlankView, status: BlankStatus = blank.status): BlankInput => ({
  name: blank.name,
  description: blank.description,
  materialId: blank.materialId,
  shape: blank.shape,
  status,
  sortOrder: blank.sortOrder,
});

/** Putting on sale, back to draft, archiving: shown at once, put back if the server refuses. */
function StatusActions({ slug, blankId, blank }: Props & { blank: BlankView }) {
  const update = useUpdateBlank(slug, blankId);
  const recipes = useRecipes(slug);
  const toast = useToast();
  const [archiving, setArchiving] = useState(false);
  const [warning, setWarning] = useState(false);
  // What a buyer or the laser would miss if it went on sale now.
  const missing = [
    blank.photos.length === 0 && 'a product photo: the storefront shows a plain tile instead',
    recipes.data &&
      !recipes.data.recipes.some((r) => r.material.id === blank.material.id) &&
      `a recipe for ${blank.material.name}: orders would reach the laser without speed and power`,
  ].filter(Boolean) as string[];
  const putOnSale = () => (missing.length ? setWarning(true) : void change('active', `${blank.name} is on sale.`));
  const change = async (status: BlankStatus, message: string) => {
    setArchiving(false);
    setWarning(false);
    try {
      await update.mutateAsync(toInput(blank, status));
      toast.show(message, 'success');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  };
  return (
    <div className="flex items-center gap-2">
      <StatusPill status={blank.status} sizes={blank.sizes.length} />
      {blank.status !== 'active' && (
        <Button onClick={putOnSale} disabled={blank.sizes.length === 0} title={blank.sizes.length === 0 ? 'Add a size first' : undefined}>
          Put on sale
        </Button>
      )}
      {blank.status === 'active' && (
        <Button variant="secondary" onClick={() => void change('draft', `${blank.name} is back in draft and off the storefront.`)}>
          Take off sale
        </Button>
      )}
      {blank.status !== 'archived' && (
        <Button variant="quiet" onClick={() => setArchiving(true)}>
          Archive
        </Button>
      )}
      <Dialog
        open={warning}
        title={`Put ${blank.name} on sale without…`}
        onClose={() => setWarning(false)}
        confirm={{ label: 'Put on sale anyway', onConfirm: () => void change('active', `${blank.name} is on sale.`) }}
      >
        <ul className="list-disc pl-5">
          {missing.map((m) => (
            <li key={m}>{m}</li>
          ))}
        </ul>
      </Dialog>
      <Dialog
        open={archiving}
        title={`Archive ${blank.name}?`}
        onClose={() => setArchiving(false)}
        confirm={{ label: 'Archive blank', onConfirm: () => void change('archived', `${blank.name} archived.`) }}
      >
        It leaves the storefront and the list of blanks on sale. Orders that name it keep it; you can put it back on sale later.
      </Dialog>
    </div>
  );
}

function BlankDetail({
  slug,
  blankId,
  units,
  currency,
  canEdit,
  blank,
  materials,
}: Props & { blank: BlankView; materials: MaterialView[] }) {
  return (
    <div className="flex flex-col gap-6">
      <SizesCard slug={slug} blankId={blankId} units={units} currency={currency} canEdit={canEdit} blank={blank} />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <CardTitle>Details</CardTitle>
          <DetailsForm slug={slug} blankId={blankId} canEdit={canEdit} blank={blank} materials={materials} />
        </Card>
        <Card>
          <CardTitle>Product photos</CardTitle>
          <PhotoPanel slug={slug} blankId={blankId} photos={blank.photos} canEdit={canEdit} />
        </Card>
      </div>
    </div>
  );
}

function DetailsForm({
  slug,
  blankId,
  canEdit,
  blank,
  materials,
}: {
  slug: string;
  blankId: string;
  canEdit: boolean;
  blank: BlankView;
  materials: MaterialView[];
}) {
  const update = useUpdateBlank(slug, blankId);
  const toast = useToast();
  // Status has its own buttons; the form keeps whatever it is now.
  const form = useForm<BlankFormValues, unknown, BlankInput>({
    resolver: zodResolver(blankInputSchema),
    values: toInput(blank),
    resetOptions: { keepDirtyValues: true },
  });
  const onSubmit = form.handleSubmit(async (input) => {
    try {
      await update.mutateAsync(input);
      toast.show('Blank saved.', 'success');
    } catch (error) {
      showServerError(form, error);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {serverErrorOf(form) && <Notice tone="error">{serverErrorOf(form)}</Notice>}
      <fieldset disabled={!canEdit} className="contents">
        <BlankFields form={form} materials={materials} withStatus={false} />
      </fieldset>
      {canEdit && (
        <Button type="submit" busy={form.formState.isSubmitting} className="self-start">
          Save details
        </Button>
      )}
    </form>
  );
}

const col = tableColumns<SizeView>();

function SizesCard({
  slug,
  blankId,
  units,
  currency,
  canEdit,
  blank,
}: {
  slug: string;
  blankId: string;
  units: LengthUnit;
  currency: string;
  canEdit: boolean;
  blank: BlankView;
}) {
  const remove = useRemoveSize(slug, blankId);
  const [editing, setEditing] = useState<SizeView | 'new'>();
  const removal = useConfirmedDelete(
    (size: SizeView) => remove.mutateAsync(size.id),
    (size) => `Size ${size.label} removed.`,
  );
  const askRemoval = removal.ask;
  const columns = useMemo<DataColumn<SizeView>[]>(
    () => [
      col.accessor('label', { header: 'Size', cell: ({ row }) => <span className="font-semibold">{row.original.label}</span> }),
      col.accessor((s) => s.areaWidthMm * s.areaHeightMm, {
        id: 'area',
        header: 'Engraving area',
        cell: ({ row }) => (
          <span>
            {formatSize(row.original.areaWidthMm, row.original.areaHeightMm, units)}
            <span className="block text-xs text-graphite-500">
              blank {formatSize(row.original.outerWidthMm, row.original.outerHeightMm, units)}
            </span>
            {!row.original.fit.fits && (
              <span className="mt-1 block text-xs font-semibold text-rust-600">
                Reaches past the blank’s edge; at most{' '}
                {formatSize(row.original.fit.largest.widthMm, row.original.fit.largest.heightMm, units)} fits. Edit the size.
              </span>
            )}
          </span>
        ),
      }),
      col.accessor('orientation', {
        header: 'Orientation',
        enableSorting: false,
        cell: ({ row }) => ORIENTATION_LABELS[row.original.orientation],
      }),
      col.accessor('priceMinor', { header: 'Price', cell: ({ row }) => formatMoney(row.original.priceMinor, currency) }),
      col.accessor((s) => s.stock ?? Number.MAX_SAFE_INTEGER, {
        id: 'stock',
        header: 'Stock',
        cell: ({ row }) =>
          row.original.stock === null ? (
            'Unlimited'
          ) : row.original.stock === 0 ? (
            <span className="font-semibold text-rust-600">Sold out</span>
          ) : (
            row.original.stock
          ),
      }),
      col.accessor('sku', { header: 'SKU' }),
      ...(canEdit
        ? [
            col.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: ({ row }) => (
                <RowActions
                  name={`size ${row.original.label}`}
                  deleteWord="Remove"
                  onEdit={() => setEditing(row.original)}
                  onDelete={() => askRemoval(row.original)}
                />
              ),
            }),
          ]
        : []),
    ],
    [units, currency, canEdit, askRemoval],
  );
  return (
    <Card>
      <CardTitle
        aside={
          canEdit && (
            <Button size="sm" onClick={() => setEditing('new')}>
              Add size
            </Button>
          )
        }
      >
        Sizes and prices
      </CardTitle>
      {blank.status === 'active' && blank.sizes.length === 0 && (
        <Notice tone="caution">This blank is on sale but has no sizes, so buyers cannot see it. Add a size.</Notice>
      )}
      {blank.sizes.some((s) => !s.fit.fits) && (
        <Notice tone="caution" title="An engraving area does not fit this blank">
          {blank.sizes
            .filter((s) => !s.fit.fits)
            .map((s) => s.label)
            .join(', ')}
          : the area reaches past the edge of the blank’s shape. Burns stay inside the shape drawn in the area, but the area itself should
          fit the piece: edit the size to the largest area that fits.
        </Notice>
      )}
      <DataTable
        caption={`Sizes of ${blank.name}`}
        data={blank.sizes}
        columns={columns}
        getRowId={(s) => s.id}
        searchLabel="Search sizes"
        initialSorting={[{ id: 'priceMinor', desc: false }]}
        empty="No sizes yet."
      />
      {editing && (
        <SizeDialog
          slug={slug}
          blankId={blankId}
          shape={blank.shape}
          units={units}
          currency={currency}
          size={editing === 'new' ? undefined : editing}
          onClose={() => setEditing(undefined)}
        />
      )}
      <Dialog
        open={Boolean(removal.pending)}
        title={`Remove size ${removal.pending?.label ?? ''}?`}
        onClose={removal.cancel}
        confirm={{ label: 'Remove size', danger: true, onConfirm: () => void removal.confirm() }}
      >
        Buyers can no longer choose it. Orders already placed keep their own copy of the size and its price.
      </Dialog>
    </Card>
  );
}
