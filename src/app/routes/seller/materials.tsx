import { useCallback, useState } from 'react';
import type { Material } from '../../../../shared/schemas/material.ts';
import { Button } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { PagedResults, usePagedQuery } from '../../../components/ui/pager.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { useMaterials } from '../../../features/materials/api/get-materials.ts';
import { useUpdateMaterial } from '../../../features/materials/api/update-material.ts';
import { MaterialForm } from '../../../features/materials/components/material-form.tsx';
import { MaterialsTable } from '../../../features/materials/components/materials-table.tsx';
import { useOwnShop } from '../../../features/shop-settings/api/get-own-shop.ts';

/** what the page says before the first one is added */
const EMPTY = { title: 'No materials yet.', hint: 'Add the vinyl you cut from; listings offer these as colour choices.' };

export function MaterialsPage() {
  const materials = usePagedQuery(useMaterials);
  const shop = useOwnShop();
  const toast = useToast();
  const update = useUpdateMaterial();
  const [editing, setEditing] = useState<Material | 'new' | null>(null);

  const onEdit = useCallback((m: Material) => {
    setEditing(m);
    window.scrollTo({ top: 0, behavior: 'smooth' });
  }, []);
  const { mutate } = update;
  const onArchive = useCallback(
    (m: Material) =>
      mutate(
        { id: m.id, input: { archived: !m.archived } },
        { onSuccess: () => toast.success(m.archived ? `${m.colourName} is back in use.` : `${m.colourName} is archived; new listings can't use it.`), onError: (e) => toast.error(e.message) },
      ),
    [mutate, toast],
  );

  return (
    <div>
      <PageHeading eyebrow="Workroom" title="Materials" lead="Your vinyl rolls and sheets: colour, width, what is left, and how each one is pressed." />
      {editing ? (
        <div className="mb-8 max-w-3xl">
          <h2 className="mb-4 text-2xl font-extrabold">{editing === 'new' ? 'Add a material' : `Edit ${editing.colourName}`}</h2>
          <MaterialForm key={editing === 'new' ? 'new' : editing.id} material={editing === 'new' ? undefined : editing} onDone={() => setEditing(null)} />
        </div>
      ) : (
        <Button className="mb-6" onClick={() => setEditing('new')}>
          Add a material
        </Button>
      )}
      <PagedResults list={materials} loading="Loading materials…" label="Material pages" noun="materials" empty={EMPTY}>
        {(items) => <MaterialsTable materials={items} pressType={shop.data?.pressType ?? 'clamshell'} onEdit={onEdit} onArchive={onArchive} />}
      </PagedResults>
    </div>
  );
}

export default MaterialsPage;
