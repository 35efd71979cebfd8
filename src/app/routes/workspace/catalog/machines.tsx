import { useMemo, useState } from 'react';
import { can } from '#shared/permissions.ts';
import { LASER_KIND_LABELS, SPEED_UNIT_LABELS, type MachineView } from '#shared/schemas/catalog.ts';
import { formatBedSize, type LengthUnit } from '#shared/units.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { DataTable, tableColumns, type DataColumn } from '#src/components/ui/data-table.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { useDeleteMachine, useMachines } from '#src/features/catalog/api/catalog.ts';
import { RowActions, useConfirmedDelete } from '#src/features/catalog/components/row-actions.tsx';
import { CatalogFrame, QueryState } from '#src/features/catalog/components/catalog-frame.tsx';
import { MachineDialog } from '#src/features/catalog/components/machine-dialog.tsx';
import { laserKindOptions } from '#src/features/catalog/labels.ts';

export function MachinesPage() {
  return (
    <WithWorkspace>
      {({ studio, role }) => <Machines slug={studio.slug} units={studio.units} canEdit={can(role, 'catalog:write')} />}
    </WithWorkspace>
  );
}

const col = tableColumns<MachineView>();

function Machines({ slug, units, canEdit }: { slug: string; units: LengthUnit; canEdit: boolean }) {
  const machines = useMachines(slug);
  const remove = useDeleteMachine(slug);
  const [editing, setEditing] = useState<MachineView | 'new'>();
  const deletion = useConfirmedDelete(
    (machine: MachineView) => remove.mutateAsync(machine.id),
    (machine) => `${machine.name} deleted.`,
  );
  const askDeletion = deletion.ask;

  const columns = useMemo<DataColumn<MachineView>[]>(
    () => [
      col.accessor('name', { header: 'Machine', cell: ({ row }) => <span className="font-semibold">{row.original.name}</span> }),
      col.accessor('laserKind', {
        header: 'Laser',
        filterFn: 'equalsString',
        cell: ({ row }) => LASER_KIND_LABELS[row.original.laserKind],
      }),
      col.accessor('powerWatts', { header: 'Power', cell: ({ row }) => `${row.original.powerWatts} W` }),
      col.accessor((k) => k.bedWidthMm * k.bedHeightMm, {
        id: 'bed',
        header: 'Bed',
        cell: ({ row }) => formatBedSize(row.original.bedWidthMm, row.original.bedHeightMm, units),
      }),
      col.accessor('speedUnit', { header: 'Speed in', enableSorting: false, cell: ({ row }) => SPEED_UNIT_LABELS[row.original.speedUnit] }),
      ...(canEdit
        ? [
            col.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: ({ row }) => (
                <RowActions name={row.original.name} onEdit={() => setEditing(row.original)} onDelete={() => askDeletion(row.original)} />
              ),
            }),
          ]
        : []),
    ],
    [canEdit, units, askDeletion],
  );

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
      {editing && (
        <MachineDialog slug={slug} units={units} machine={editing === 'new' ? undefined : editing} onClose={() => setEditing(undefined)} />
      )}
      <Dialog
        open={Boolean(deletion.pending)}
        title={`Delete ${deletion.pending?.name ?? ''}?`}
        onClose={deletion.cancel}
        confirm={{ label: 'Delete machine', danger: true, onConfirm: () => void deletion.confirm() }}
      >
        The recipes written for this machine are deleted with it.
      </Dialog>
    </CatalogFrame>
  );
}
