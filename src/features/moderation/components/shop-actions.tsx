import { useState } from 'react';
import type { ShopState } from '../../../../shared/schemas/shop.ts';
import { Button } from '../../../components/ui/button.tsx';
import { useToast } from '../../../components/ui/toast.tsx';
import { useMoveShop } from '../api/move-shop.ts';
import type { ShopMove } from '../api/types.ts';
import { ReasonForm } from './reason-form.tsx';

const done: Record<ShopMove, string> = { approve: 'approved', reject: 'rejected', suspend: 'suspended', restore: 'restored' };

/** The moves a shop in this state allows (server/features/moderation/moderation.service.ts SHOP_MOVES). */
export function movesFor(state: ShopState): ShopMove[] {
  if (state === 'in_review') return ['approve', 'reject'];
  if (state === 'live') return ['suspend'];
  if (state === 'suspended') return ['restore'];
  return [];
}

/** `revision`: the revision of the name/description on screen (the queue has it), sent with approve. */
export function ShopActions({ shop }: { shop: { id: string; name: string; state: ShopState; revision?: number } }) {
  const toast = useToast();
  const move = useMoveShop();
  const [asking, setAsking] = useState<'reject' | 'suspend' | null>(null);
  const moves = movesFor(shop.state);

  const run = async (m: ShopMove, reason?: string) => {
    await move.mutateAsync({ id: shop.id, move: m, reason, revision: shop.revision });
    toast.success(`${shop.name} is ${done[m]}.`);
    setAsking(null);
  };

  if (asking)
    return (
      <ReasonForm
        label={asking === 'reject' ? `Why is ${shop.name} not approved?` : `Why is ${shop.name} suspended?`}
        submitLabel={asking === 'reject' ? 'Reject shop' : 'Suspend shop'}
        danger
        onSubmit={(reason) => run(asking, reason)}
        onCancel={() => setAsking(null)}
      />
    );
  if (moves.length === 0) return null;
  return (
    <div className="flex flex-wrap gap-2">
      {moves.includes('approve') ? (
        <Button pending={move.isPending} onClick={() => void run('approve').catch((e: Error) => toast.error(e.message))}>
          Approve shop<span className="sr-only"> {shop.name}</span>
        </Button>
      ) : null}
      {moves.includes('restore') ? (
        <Button pending={move.isPending} onClick={() => void run('restore').catch((e: Error) => toast.error(e.message))}>
          Restore shop<span className="sr-only"> {shop.name}</span>
        </Button>
      ) : null}
      {moves.includes('reject') ? (
        <Button variant="secondary" onClick={() => setAsking('reject')}>
          Reject shop<span className="sr-only"> {shop.name}</span>
        </Button>
      ) : null}
      {moves.includes('suspend') ? (
        <Button variant="secondary" className="border-danger text-danger hover:bg-danger-wash" onClick={() => setAsking('suspend')}>
          Suspend shop<span className="sr-only"> {shop.name}</span>
        </Button>
      ) : null}
    </div>
  );
}
