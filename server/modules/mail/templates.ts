// The words of each e-mail Heelwood sends, kept apart from the sending.
import type { OutgoingMail } from './mailer.js';

export function passwordResetMail(p: { to: string; name: string; url: string }): OutgoingMail {
  return {
    kind: 'password_reset',
    to: p.to,
    subject: 'Reset your Heelwood password',
    text: [
      `Hello ${p.name},`,
      '',
      'Someone (we hope you) asked to reset the password of your Heelwood account.',
      'Open this link within an hour to choose a new one:',
      '',
      p.url,
      '',
      'If you did not ask, ignore this message: your password stays as it is.',
      '',
      '— Heelwood, for your fruit-growing cooperative',
    ].join('\n'),
  };
}
