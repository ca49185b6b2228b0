// The fake SMTP server's mailbox, as the browser tests read it (started by the e2e global setup).
export type Message = { to: string[]; subject: string; text: string; html: string | null };

export async function mailbox(): Promise<Message[]> {
  const url = process.env.E2E_MAILBOX_URL;
  if (!url) throw new Error('E2E_MAILBOX_URL is not set: the e2e global setup did not start the fakes');
  return (await (await fetch(`${url}/api/messages`)).json()).messages;
}

/** The first message to `email` whose subject matches, waiting for the worker to send it. */
export async function messageTo(email: string, subject: RegExp, timeoutMs = 20_000): Promise<Message> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const found = (await mailbox()).find((m) => m.to.includes(email) && subject.test(m.subject));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no message to ${email} matching ${subject}`);
}
