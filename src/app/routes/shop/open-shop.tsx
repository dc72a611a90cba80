import { useQueryClient } from '@tanstack/react-query';
import { Navigate, useNavigate } from 'react-router-dom';
import { useToast } from '../../../components/ui/toast.tsx';
import { paths } from '../../../config/paths.ts';
import { useMe } from '../../../features/auth/api/get-me.ts';
import { authKeys } from '../../../features/auth/api/keys.ts';
import { OpenShopForm } from '../../../features/shops/components/open-shop-form.tsx';
import { AuthPanel } from '../auth/auth-panel.tsx';

export function OpenShopPage() {
  const me = useMe();
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const toast = useToast();

  // One shop per account: someone who already has one goes to its workroom.
  if (me.data?.shop) return <Navigate to={paths.workroom.getHref()} replace />;

  return (
    <AuthPanel
      title="Open a shop on Namesake"
      lead={
        <>
          <p>Sell personalised totes, tees, pouches and drawstring bags that you cut and press yourself.</p>
          <p className="mt-2">Our team looks at every new shop before it goes public; you can set up your workroom in the meantime.</p>
        </>
      }
    >
      <OpenShopForm
        onOpened={async (shop) => {
          // Opening a shop makes this account a seller: fetch the new role before the workroom guard looks.
          await queryClient.invalidateQueries({ queryKey: authKeys.all });
          toast.success(`${shop.name} is open and waiting for review.`);
          navigate(paths.workroom.getHref());
        }}
      />
    </AuthPanel>
  );
}
