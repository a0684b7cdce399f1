import type { Config } from '../../config';
import { appUrl, renderMail, type OutgoingMail } from '../mail/index';

/** The reset e-mail: the single-use link, valid for 30 minutes. */
export function passwordResetMail(
  config: Pick<Config, 'APP_URL'>,
  m: { to: string; name: string; token: string },
): OutgoingMail {
  const content = renderMail({
    heading: 'Choose a new password',
    paragraphs: [
      `Hello ${m.name},`,
      'Someone, hopefully you, asked to reset the password of your Lightoff sign-in. ' +
        'Open the link within 30 minutes and choose a new one. The link works once; ' +
        'using it signs you out on every device.',
    ],
    action: { label: 'Choose a new password', url: appUrl(config, `/reset/${m.token}`) },
    footer:
      'If you did not ask for this, ignore this e-mail: your password stays as it is. ' +
      'If it keeps happening, tell your branch.',
  });
  return { to: m.to, subject: 'Reset your Lightoff password', ...content };
}
