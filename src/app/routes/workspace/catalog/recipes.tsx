import { useMemo, useState } from 'react';
import { can } from '#shared/permissions.ts';
import { SPEED_UNIT_LABELS, type RecipeView } from '#shared/schemas/catalog.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { Button } from '#src/components/ui/button.tsx';
import { DataTable, tableColumns, type DataColumn } from '#src/components/ui/data-table.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useDeleteRecipe, useMachines, useMaterials, useRecipes } from '#src/features/catalog/api/catalog.ts';
import { RowActions, useConfirmedDelete } from '#src/features/catalog/components/row-actions.tsx';
import { CatalogFrame, QueryState } from '#src/features/catalog/components/catalog-frame.tsx';
import { LaserCautions } from '#src/features/catalog/components/laser-cautions.tsx';
import { RecipeDialog } from '#src/features/catalog/components/recipe-dialog.tsx';
import { methodLabel } from '#src/features/catalog/labels.ts';

export function RecipesPage() {
  return <WithWorkspace>{({ studio, role }) => <Recipes slug={studio.slug} canEdit={can(role, 'catalog:write')} />}</WithWorkspace>;
}

const col = tableColumns<RecipeView>();

function Recipes({ slug, canEdit }: { slug: string; canEdit: boolean }) {
  const recipes = useRecipes(slug);
  const materials = useMaterials(slug);
  const machines = useMachines(slug);
  const remove = useDeleteRecipe(slug);
  const [editing, setEditing] = useState<RecipeView | 'new'>();
  const deletion = useConfirmedDelete(
    (recipe: RecipeView) => remove.mutateAsync(recipe.id),
    () => 'Recipe deleted.',
  );
  const askDeletion = deletion.ask;

  const columns = useMemo<DataColumn<RecipeView>[]>(
    () => [
      col.accessor((r) => r.material.name, {
        id: 'material',
        header: 'Material',
        cell: ({ row }) => <span className="font-semibold">{row.original.material.name}</span>,
      }),
      col.accessor((r) => r.machine.name, { id: 'machine', header: 'Machine', filterFn: 'equalsString' }),
      col.accessor('linesPerInch', { header: 'Lines per inch' }),
      col.accessor('halftoneMethod', { header: 'Method', cell: ({ row }) => methodLabel(row.original.halftoneMethod) }),
      col.accessor('tone', { header: 'Tone', cell: ({ row }) => (row.original.tone === 'negative' ? 'Negative' : 'Positive') }),
      col.accessor('speed', {
        header: 'Speed',
        cell: ({ row }) => `${row.original.speed} ${SPEED_UNIT_LABELS[row.original.machine.speedUnit]}`,
      }),
      col.accessor('powerMaxPercent', {
        header: 'Power',
        cell: ({ row }) => `${row.original.powerMinPercent}–${row.original.powerMaxPercent} %`,
      }),
      col.accessor('passes', { header: 'Passes' }),
      ...(canEdit
        ? [
            col.display({
              id: 'actions',
              header: () => <span className="sr-only">Actions</span>,
              cell: ({ row }) => (
                <RowActions
                  name={`the recipe for ${row.original.material.name} on ${row.original.machine.name}`}
                  onEdit={() => setEditing(row.original)}
                  onDelete={() => askDeletion(row.original)}
                />
              ),
            }),
          ]
        : []),
    ],
    [canEdit, askDeletion],
  );

  const noMachines = machines.data?.machines.length === 0;
  return (
    <CatalogFrame
      slug={slug}
      title="Recipes"
      canEdit={canEdit}
      actions={
        <Button onClick={() => setEditing('new')} disabled={!materials.data || !machines.data || noMachines}>
          New recipe
        </Button>
      }
    >
      <LaserCautions />
      {canEdit && noMachines && <Notice>Add a machine first: a recipe says how a material burns on one machine.</Notice>}
      <QueryState isPending={recipes.isPending} error={recipes.error} />
      {recipes.data && (
        <DataTable
          caption="Recipes"
          data={recipes.data.recipes}
          columns={columns}
          getRowId={(r) => r.id}
          searchLabel="Search recipes"
          filters={
            machines.data
              ? [{ columnId: 'machine', label: 'Machine', options: machines.data.machines.map((k) => ({ value: k.name, label: k.name })) }]
              : []
          }
          initialSorting={[{ id: 'material', desc: false }]}
          empty="No recipes yet."
        />
      )}
      {editing && materials.data && machines.data && (
        <RecipeDialog
          slug={slug}
          recipe={editing === 'new' ? undefined : editing}
          materials={materials.data.materials}
          machines={machines.data.machines}
          onClose={() => setEditing(undefined)}
        />
      )}
      <Dialog
        open={Boolean(deletion.pending)}
        title="Delete this recipe?"
        onClose={deletion.cancel}
        confirm={{ label: 'Delete recipe', danger: true, onConfirm: () => void deletion.confirm() }}
      >
        {deletion.pending &&
          `${deletion.pending.material.name} on ${deletion.pending.machine.name}. Orders already placed keep the settings they were made with.`}
      </Dialog>
    </CatalogFrame>
  );
}
