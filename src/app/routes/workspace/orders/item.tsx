import { useParams } from 'react-router-dom';
import { can } from '#shared/permissions.ts';
import { WithWorkspace } from '#src/app/layouts/workspace-layout.tsx';
import { PrepEditor } from '#src/features/orders/components/prep-editor.tsx';

export function StaffItemPage() {
  const { itemId = '' } = useParams();
  return (
    <WithWorkspace>
      {({ studio, role, orders }) => (
        <PrepEditor slug={studio.slug} itemId={itemId} canProduce={can(role, 'order:produce')} proofsRequired={orders.proofsRequired} />
      )}
    </WithWorkspace>
  );
}
