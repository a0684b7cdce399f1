import nodemailer from 'nodemailer';
import type { AppContext } from '../../context';
import type { Executor } from '../../db/client';

/** One e-mail, ready to send: both a text and an HTML part. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export const MAIL_QUEUE = 'mail.send';

/**
 * Stores the e-mail in the job queue (inside `tx` when given, so it is sent only if the change
 * commits). It is delivered by the worker, retried with backoff while SMTP is down.
 */
export function queueMail(ctx: AppContext, mail: OutgoingMail, tx?: Executor) {
  return ctx.jobs.send(MAIL_QUEUE, mail, {}, tx);
}

/** Delivers queued e-mail over SMTP (nodemailer); a failure throws, and the job is retried. */
export async function registerMailWorker(ctx: AppContext) {
  const transport = nodemailer.createTransport({
    host: ctx.config.SMTP_HOST,
    port: ctx.config.SMTP_PORT,
    secure: false,
    connectionTimeout: 5_000,
  });
  await ctx.jobs.work<OutgoingMail & { messageId?: string }>(MAIL_QUEUE, async (mail, job) => {
    await transport.sendMail({
      from: ctx.config.MAIL_FROM,
      to: mail.to,
      subject: mail.subject,
      text: mail.text,
      html: mail.html,
      // The job's id names the message, so a resend after a lost acknowledgement is recognisable.
      messageId: `<${job.id}@lightoff.mail>`,
    });
  });
}
