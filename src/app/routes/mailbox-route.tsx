import { useSearchParams } from 'react-router-dom';
import { Mailbox } from '../../features/mail/components/mailbox';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../paths';
import { CoordinatorOnly } from './coordinator-only';

function MailboxPage() {
  const [params, setParams] = useSearchParams();
  const parsed = Number.parseInt(params.get('page') ?? '1', 10);
  const page = Number.isFinite(parsed) && parsed > 0 ? parsed : 1;

  return (
    <>
      <title>Mailbox · Heelwood</title>
      <PageHeader title="Mailbox" lead="The e-mail Heelwood has sent." />
      <Mailbox
        page={page}
        onPageChange={(next) => {
          setParams(new URLSearchParams(paths.mailbox(next).split('?')[1] ?? ''));
          window.scrollTo({ top: 0 });
        }}
      />
    </>
  );
}

export function MailboxRoute() {
  return (
    <CoordinatorOnly>
      <MailboxPage />
    </CoordinatorOnly>
  );
}
