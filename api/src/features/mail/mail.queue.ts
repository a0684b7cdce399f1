import nodemailer from 'nodemailer';
import type { Config } from '../../config';
import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';
import type { QueueSettings } from '../../lib/jobs';

/** One e-mail, ready to send: both a text and an HTML part (render them with `renderMail`). */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra headers, e.g. `List-Unsubscribe` on optional e-mails (see `unsubscribeHeaders`). */
  headers?: Record<string, string>;
}

export const MAIL_QUEUE = 'mail.send';

/**
 * Mail keeps trying for the week a job is kept: twenty more attempts whose gaps double from
 * `MAIL_RETRY_DELAY_SECONDS` (5 s, 10 s, 20 s, … up to about two days), so an SMTP outage only delays it.
 */
export const mailQueueSettings = (config: Config): QueueSettings => ({
  retryLimit: 20,
  retryDelay: config.MAIL_RETRY_DELAY_SECONDS,
  retryBackoff: true,
});

/**
 * Stores the e-mail in the job queue (inside `tx` when given, so it is sent only if the change
 * commits). It is delivered by the worker, retried with backoff while SMTP is down.
 */
export function queueMail(ctx: AppContext, mail: OutgoingMail, tx?: Executor) {
  return ctx.jobs.send(MAIL_QUEUE, mail, {}, tx);
}

/** Delivers queued e-mail over SMTP (nodemailer); a failure throws, and the job is retried. */
export async function registerMailWorker(ctx: AppContext) {
  const { config } = ctx;
  const transport = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    ...(config.SMTP_USER ? { auth: { user: config.SMTP_USER, pass: config.SMTP_PASSWORD ?? '' } } : {}),
    connectionTimeout: 5_000,
    // A burst (a hundred tickets at once) reuses a couple of SMTP connections instead of one each.
    pool: true,
    maxConnections: 2,
  });
  await ctx.jobs.work<OutgoingMail>(MAIL_QUEUE, async (mail, job) => {
    await transport.sendMail({
      from: config.MAIL_FROM,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      headers: mail.headers,
      // The job's id names the message, so a resend after a lost acknowledgement is recognisable.
      messageId: `<${job.id}@lightoff.mail>`,
    });
  });
}
