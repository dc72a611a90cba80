import { useQueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { Button } from '../../../components/ui/button.tsx';
import { PageHeading } from '../../../components/ui/card.tsx';
import { mailKeys } from '../../../features/mail/api/keys.ts';
import { MailList } from '../../../features/mail/components/mail-list.tsx';
import { MailViewer } from '../../../features/mail/components/mail-viewer.tsx';

export function MailPage() {
  const [params] = useSearchParams();
  const selectedId = params.get('message');
  const queryClient = useQueryClient();

  return (
    <div>
      <PageHeading eyebrow="Moderation desk" title="Mail" lead="Messages Namesake has sent, captured by the local mail server instead of going out." />
      <div className="mb-4">
        <Button variant="secondary" onClick={() => queryClient.invalidateQueries({ queryKey: mailKeys.lists() })}>
          Check for new mail
        </Button>
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <MailList selectedId={selectedId} />
        <MailViewer id={selectedId} />
      </div>
    </div>
  );
}
