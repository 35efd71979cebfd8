import { useMemo, useState } from 'react';
import { can } from '../../../../../shared/permissions.ts';
import { LASER_KIND_LABELS, SPEED_UNIT_LABELS, type MachineView } from '../../../../../shared/schemas/catalog.ts';
import { formatSize, type LengthUnit } from '../../../../../shared/units.ts';
import { WorkspaceLayout } from '../../../../components/layouts/workspace-layout.tsx';
import { Button } from '../../../../components/ui/button.tsx';
import { DataTable, tableColumns, type DataColumn } from '../../../../components/ui/data-table.tsx';
import { Dialog } from '../../../../components/ui/dialog.tsx';
import { useToast } from '../../../../components/ui/toast.tsx';
import { useDeleteMachine, useMachines } from '../../../../features/catalog/api/catalog.ts';
import { CatalogFrame, QueryState } from '../../../../features/catalog/components/catalog-frame.tsx';
import { MachineDialog } from '../../../../features/catalog/components/machine-dialog.tsx';
import { laserKindOptions } from '../../../../features/catalog/labels.ts';

export function MachinesPage() {
  return <WorkspaceLayout>{({ studio, role }) => <Machines slug={studio.slug} units={studio.units} canEdit={can(role, 'catalog:write')} />}</WorkspaceLayout>;
}

const col = tableColumns<MachineView>();

function Machines({ slug, units, canEdit }: { slug: string; units: LengthUnit; canEdit: boolean }) {
  const machines = useMachines(slug);
  const remove = useDeleteMachine(slug);
  const toast = useToast();
  const [editing, setEditing] = useState<MachineView | 'new'>();
  const [deleting, setDeleting] = useState<MachineView>();

  const columns = useMemo<DataColumn<MachineView>[]>(
    () => [
      col.accessor('name', { header: 'Machine', cell: ({ row }) => <span className="font-semibold">{row.original.name}</span> }),
      col.accessor('laserKind', { header: 'Laser', filterFn: 'equalsString', cell: ({ row }) => LASER_KIND_LABELS[row.original.laserKind] }),
      col.accessor('powerWatts', { header: 'Power', cell: ({ row }) => `${row.original.powerWatts} W` }),
      col.accessor((k) => k.bedWidthMm * k.bedHeightMm, { id: 'bed', header: 'Bed', cell: ({ row }) => formatSize(row.original.bedWidthMm, row.original.bedHeightMm, units) }),
      col.accessor('speedUnit', { header: 'Speed in', enableSorting: false, cell: ({ row }) => SPEED_UNIT_LABELS[row.original.speedUnit] }),
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
                  <Button size="sm" variant="quiet" onClick={() => setDeleting(row.original)} aria-label={`Delete ${row.original.name}`}>
                    Delete
                  </Button>
                </span>
              ),
            }),
          ]
        : []),
    ],
    [canEdit, units],
  );

  async function confirmDelete() {
    const machine = deleting!;
    setDeleting(undefined);
    try {
      await remove.mutateAsync(machine.id);
      toast.show(`${machine.name} deleted.`, 'success');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  }

  return (
    <CatalogFrame slug={slug} title="Machines" canEdit={canEdit} actions={<Button onClick={() => setEditing('new')}>New machine</Button>}>
      <QueryState isPending={machines.isPending} error={machines.error} />
      {machines.data && (
        <DataTable
          caption="Machines"
          data={machines.data.machines}
          columns={columns}
          getRowId={(k) => k.id}
          searchLabel="Search machines"
          filters={[{ columnId: 'laserKind', label: 'Laser', options: laserKindOptions }]}
          initialSorting={[{ id: 'name', desc: false }]}
          empty="No machines yet. Add the lasers your studio runs, then write recipes for them."
        />
      )}
      {editing && <MachineDialog slug={slug} units={units} machine={editing === 'new' ? undefined : editing} onClose={() => setEditing(undefined)} />}
      <Dialog open={Boolean(deleting)} title={`Delete ${deleting?.name ?? ''}?`} onClose={() => setDeleting(undefined)} confirm={{ label: 'Delete machine', danger: true, onConfirm: confirmDelete }}>
        The recipes written for this machine are deleted with it.
      </Dialog>
    </CatalogFrame>
  );
}
