import { mailboxUrl } from '@/lib/env';

/** In the demo only (MAILBOX_URL set): a link to the fake SMTP server's page with every message sent. */
export function DemoMailboxLink() {
  const url = mailboxUrl();
  if (!url) return null;
  return (
    <a href={url} target="_blank" rel="noreferrer">
      Demo mailbox (local e-mail)
    </a>
  );
}
