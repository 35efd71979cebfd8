import { useMemo, useState } from 'react';
import { can } from '../../../../../shared/permissions.ts';
import { LASER_KIND_LABELS, type MaterialView } from '../../../../../shared/schemas/catalog.ts';
import { WorkspaceLayout } from '../../../../components/layouts/workspace-layout.tsx';
import { Button } from '../../../../components/ui/button.tsx';
import { DataTable, tableColumns, type DataColumn } from '../../../../components/ui/data-table.tsx';
import { Dialog } from '../../../../components/ui/dialog.tsx';
import { useToast } from '../../../../components/ui/toast.tsx';
import { useDeleteMaterial, useMaterials } from '../../../../features/catalog/api/catalog.ts';
import { CatalogFrame, QueryState } from '../../../../features/catalog/components/catalog-frame.tsx';
import { MaterialDialog } from '../../../../features/catalog/components/material-dialog.tsx';
import { Swatch } from '../../../../features/catalog/components/swatch.tsx';
import { FAMILY_LABELS, familyOptions } from '../../../../features/catalog/labels.ts';

export function MaterialsPage() {
  return <WorkspaceLayout>{({ studio, role }) => <Materials slug={studio.slug} canEdit={can(role, 'catalog:write')} />}</WorkspaceLayout>;
}

const col = tableColumns<MaterialView>();

function Materials({ slug, canEdit }: { slug: string; canEdit: boolean }) {
  const materials = useMaterials(slug);
  const remove = useDeleteMaterial(slug);
  const toast = useToast();
  const [editing, setEditing] = useState<MaterialView | 'new'>();
  const [deleting, setDeleting] = useState<MaterialView>();

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
      col.accessor((m) => m.linesPerInchMin, { id: 'density', header: 'Lines per inch', cell: ({ row }) => `${row.original.linesPerInchMin}–${row.original.linesPerInchMax}` }),
      col.accessor((m) => (m.forbiddenOn.length ? `Never on ${m.forbiddenOn.map((k) => LASER_KIND_LABELS[k]).join(', ')}` : ''), {
        id: 'limits',
        header: 'Laser limits',
        cell: ({ getValue, row }) => (getValue() ? <span className="font-semibold text-rust-600" title={row.original.forbiddenReason}>{getValue()}</span> : <span className="text-graphite-400">—</span>),
      }),
      col.accessor('blankCount', { header: 'Blanks', cell: ({ getValue }) => getValue() || <span className="text-graphite-400">0</span> }),
      ...(canEdit
        ? [
            col.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: ({ row }) => (
                <span className="inline-flex gap-1">
                  <Button size="sm" variant="quiet" onClick={() => setEditing(row.original)} aria-label={`Edit ${row.original.name}`}>
                    Edit
                  </Button>
                  <Button
                    size="sm"
                    variant="quiet"
                    disabled={row.original.blankCount > 0}
                    title={row.original.blankCount > 0 ? 'Blanks use this material' : undefined}
                    onClick={() => setDeleting(row.original)}
                    aria-label={`Delete ${row.original.name}`}
                  >
                    Delete
                  </Button>
                </span>
              ),
            }),
          ]
        : []),
    ],
    [canEdit],
  );

  async function confirmDelete() {
    const material = deleting!;
    setDeleting(undefined);
    try {
      await remove.mutateAsync(material.id);
      toast.show(`${material.name} deleted.`, 'success');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  }

  return (
    <CatalogFrame slug={slug} title="Materials" canEdit={canEdit} actions={<Button onClick={() => setEditing('new')}>New material</Button>}>
      <p className="max-w-3xl text-graphite-600">
        What your blanks are made of: how each looks (for the buyer’s mock-up), whether photos burn on it as a negative, the line densities that suit it, and lasers it must never go on.
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
      <Dialog open={Boolean(deleting)} title={`Delete ${deleting?.name ?? ''}?`} onClose={() => setDeleting(undefined)} confirm={{ label: 'Delete material', danger: true, onConfirm: confirmDelete }}>
        Its recipes are deleted with it. Orders already placed keep their own copy of what they need.
      </Dialog>
    </CatalogFrame>
  );
}
