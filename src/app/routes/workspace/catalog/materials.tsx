import { useMemo, useState } from 'react';
import { can } from '#shared/permissions.ts';
import { LASER_KIND_LABELS, type MaterialView } from '#shared/schemas/catalog.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { DataTable, tableColumns, type DataColumn } from '#src/components/ui/data-table.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { useDeleteMaterial, useMaterials } from '#src/features/catalog/api/catalog.ts';
import { RowActions, useConfirmedDelete } from '#src/features/catalog/components/row-actions.tsx';
import { CatalogFrame, QueryState } from '#src/features/catalog/components/catalog-frame.tsx';
import { MaterialDialog } from '#src/features/catalog/components/material-dialog.tsx';
import { Swatch } from '#src/features/catalog/components/swatch.tsx';
import { FAMILY_LABELS, familyOptions } from '#src/features/catalog/labels.ts';

export function MaterialsPage() {
  return <WithWorkspace>{({ studio, role }) => <Materials slug={studio.slug} canEdit={can(role, 'catalog:write')} />}</WithWorkspace>;
}

const col = tableColumns<MaterialView>();

function Materials({ slug, canEdit }: { slug: string; canEdit: boolean }) {
  const materials = useMaterials(slug);
  const remove = useDeleteMaterial(slug);
  const [editing, setEditing] = useState<MaterialView | 'new'>();
  const deletion = useConfirmedDelete(
    (material: MaterialView) => remove.mutateAsync(material.id),
    (material) => `${material.name} deleted.`,
  );
  const askDeletion = deletion.ask;

  const columns = useMemo<DataColumn<MaterialView>[]>(
    () => [
      col.accessor('name', {
        header: 'Material',
        cell: ({ row }) => (
          <span className="flex items-center gap-3 font-semibold">
            <Swatch surface={row.original.surfaceColour} mark={row.original.markColour} />
            {row.original.name}
          </span>
        ),
      }),
      col.accessor('family', { header: 'Family', filterFn: 'equalsString', cell: ({ row }) => FAMILY_LABELS[row.original.family] }),
      col.accessor('defaultTone', { header: 'Tone', cell: ({ getValue }) => (getValue() === 'negative' ? 'Negative' : 'Positive') }),
      col.accessor((m) => m.linesPerInchMin, {
        id: 'density',
        header: 'Lines per inch',
        cell: ({ row }) => `${row.original.linesPerInchMin}–${row.original.linesPerInchMax}`,
      }),
      col.accessor((m) => (m.forbiddenOn.length ? `Never on ${m.forbiddenOn.map((k) => LASER_KIND_LABELS[k]).join(', ')}` : ''), {
        id: 'limits',
        header: 'Laser limits',
        cell: ({ getValue, row }) =>
          getValue() ? (
            <span className="font-semibold text-rust-600" title={row.original.forbiddenReason}>
              {getValue()}
            </span>
          ) : (
            <span className="text-graphite-400">—</span>
          ),
      }),
      col.accessor('blankCount', { header: 'Blanks', cell: ({ getValue }) => getValue() || <span className="text-graphite-400">0</span> }),
      ...(canEdit
        ? [
            col.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: ({ row }) => (
                <RowActions
                  name={row.original.name}
                  onEdit={() => setEditing(row.original)}
                  onDelete={() => askDeletion(row.original)}
                  deleteDisabled={row.original.blankCount > 0}
                  deleteTitle={row.original.blankCount > 0 ? 'Blanks use this material' : undefined}
                />
              ),
            }),
          ]
        : []),
    ],
    [canEdit, askDeletion],
  );

  return (
    <CatalogFrame slug={slug} title="Materials" canEdit={canEdit} actions={<Button onClick={() => setEditing('new')}>New material</Button>}>
      <p className="max-w-3xl text-graphite-600">
        What your blanks are made of: how each looks (for the buyer’s mock-up), whether photos burn on it as a negative, the line densities
        that suit it, and lasers it must never go on.
      </p>
      <QueryState isPending={materials.isPending} error={materials.error} />
      {materials.data && (
        <DataTable
          caption="Materials"
          data={materials.data.materials}
          columns={columns}
          getRowId={(m) => m.id}
          searchLabel="Search materials"
          filters={[{ columnId: 'family', label: 'Family', options: familyOptions }]}
          initialSorting={[{ id: 'name', desc: false }]}
          empty="No materials yet."
        />
      )}
      {editing && <MaterialDialog slug={slug} material={editing === 'new' ? undefined : editing} onClose={() => setEditing(undefined)} />}
      <Dialog
        open={Boolean(deletion.pending)}
        title={`Delete ${deletion.pending?.name ?? ''}?`}
        onClose={deletion.cancel}
        confirm={{ label: 'Delete material', danger: true, onConfirm: () => void deletion.confirm() }}
      >
        Its recipes are deleted with it. Orders already placed keep their own copy of what they need.
      </Dialog>
    </CatalogFrame>
  );
}
