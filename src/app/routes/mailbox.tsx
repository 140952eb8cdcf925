import { PageHeader } from '../../components/page-header';
import { Mailbox } from '../../features/mailbox/components/mailbox';

export default function MailboxRoute() {
  return (
    <>
      <PageHeader title="Mailbox" description="Every e-mail Nestkeeper has sent for your firm, newest first, as the mail server received it." />
      <Mailbox />
    </>
  );
}
