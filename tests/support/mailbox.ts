// Reads what the server sent from the run's real mail sink (maildev's JSON API at MAIL_WEB_URL).
// Other test files send mail to the same sink, so every lookup is by recipient.

export interface SinkMail {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: { address: string; name?: string }[];
}

function sinkUrl(): string {
  const url = process.env.MAIL_WEB_URL;
  if (!url)
    throw new Error('MAIL_WEB_URL is not set: run the tests through `npm test`, which starts the mail sink');
  return url.replace(/\/+$/, '');
}

/** The settings that make a test server deliver to the sink (and keep its jobs to itself). */
export function mailSinkEnv(jobsSchema: string): Record<string, string> {
  if (!process.env.SMTP_PORT) throw new Error('SMTP_PORT is not set: run the tests through `npm test`');
  return {
    SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
    SMTP_PORT: process.env.SMTP_PORT,
    MAIL_RETRY_DELAY_SECONDS: '1',
    JOBS_SCHEMA: `${jobsSchema}_${process.pid}`,
  };
}

export async function mailsTo(address: string): Promise<SinkMail[]> {
  const res = await fetch(`${sinkUrl()}/api/email`);
  if (!res.ok) throw new Error(`mail sink answered ${res.status}`);
  const all = (await res.json()) as SinkMail[];
  const wanted = address.toLowerCase();
  return all.filter((m) => m.to.some((t) => t.address.toLowerCase() === wanted));
}

/** Waits until `count` e-mails to the address have arrived; resolves with them, oldest first. */
export async function waitForMails(address: string, count = 1, timeoutMs = 15_000): Promise<SinkMail[]> {
  // performance.now, not Date: tests may move the Date clock while they wait.
  const until = performance.now() + timeoutMs;
  for (;;) {
    const found = await mailsTo(address);
    if (found.length >= count) return found;
    if (performance.now() > until) {
      throw new Error(
        `expected ${count} e-mail(s) to ${address} within ${timeoutMs} ms, found ${found.length}`,
      );
    }
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The token of the app link `/<path>/<token>` in an e-mail's text part. */
export function linkToken(mail: SinkMail, path: 'join' | 'reset'): string {
  const match = new RegExp(`/${path}/([A-Za-z0-9_-]{20,})`).exec(mail.text);
  if (!match?.[1]) throw new Error(`no /${path}/ link in the e-mail "${mail.subject}"`);
  return match[1];
}
