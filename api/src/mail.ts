import nodemailer, { type Transporter } from 'nodemailer';
import { getConfig } from './config/env';
import { serviceUnavailable } from './errors';

export interface MailMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
  /** the sender's display name instead of the configured one (the address stays ours) */
  fromName?: string;
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

/** The configured sender's address, without its display name. */
function senderAddress(mailFrom: string): string {
  return /<([^>]+)>/.exec(mailFrom)?.[1] ?? mailFrom;
}

let transport: Transporter | undefined;

function transporter(): Transporter {
  const config = getConfig();
  // Local SMTP (capture server or maildev): plain, no TLS upgrade.
  transport ??= nodemailer.createTransport({
    host: config.smtpHost,
    port: config.smtpPort,
    secure: false,
    ignoreTLS: true,
  });
  return transport;
}

/**
 * Sends one message. A mail server that cannot be reached is the service's problem, not the
 * caller's: it answers 503 with a plain message (callers that send inside a transaction then
 * roll back, so nothing is half done).
 */
export async function sendMail(message: MailMessage): Promise<void> {
  try {
    const { fromName, ...rest } = message;
    const configured = getConfig().mailFrom;
    const from =
      fromName === undefined ? configured : { name: fromName, address: senderAddress(configured) };
    await transporter().sendMail({ ...rest, from });
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw Object.assign(
      serviceUnavailable(
        'The e-mail could not be sent just now. Nothing was saved; try again shortly.',
      ),
      { cause: reason },
    );
  }
}

/** Closes pooled SMTP connections (shutdown, tests). */
export function closeMail(): void {
  transport?.close();
  transport = undefined;
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);
}

function link(path: string, token: string): string {
  const url = new URL(path, `${getConfig().appUrl}/`);
  url.searchParams.set('token', token);
  return url.toString();
}

export function passwordResetMail(to: string, name: string, token: string): MailMessage {
  const url = link('reset-password', token);
  return {
    to,
    subject: 'Reset your Basinwright password',
    text:
      `Hello ${name},\n\n` +
      `Someone asked to reset the password of your Basinwright account. To choose a new password, open:\n\n` +
      `${url}\n\nThe link works once and expires in 1 hour. If you did not ask for this, ignore this e-mail.\n`,
    html:
      `<p>Hello ${escapeHtml(name)},</p>` +
      `<p>Someone asked to reset the password of your Basinwright account.</p>` +
      `<p><a href="${escapeHtml(url)}">Choose a new password</a></p>` +
      `<p>The link works once and expires in 1 hour. If you did not ask for this, ignore this e-mail.</p>`,
  };
}

export function invitationMail(
  to: string,
  firmName: string,
  inviterName: string,
  role: string,
  token: string,
): MailMessage {
  const url = link('accept-invitation', token);
  return {
    to,
    subject: `${firmName} invited you to Basinwright`,
    text:
      `${inviterName} invited you to join ${firmName} on Basinwright as ${role}.\n\n` +
      `To accept, open:\n\n${url}\n\nThe invitation expires in 7 days.\n`,
    html:
      `<p>${escapeHtml(inviterName)} invited you to join <strong>${escapeHtml(firmName)}</strong> on Basinwright as ${escapeHtml(role)}.</p>` +
      `<p><a href="${escapeHtml(url)}">Accept the invitation</a></p>` +
      `<p>The invitation expires in 7 days.</p>`,
  };
}

/** To the owner of an address someone tried to sign up (or be invited) with. */
export function accountExistsMail(to: string, name: string): MailMessage {
  const signIn = new URL('sign-in', `${getConfig().appUrl}/`).toString();
  const reset = new URL('forgot-password', `${getConfig().appUrl}/`).toString();
  return {
    to,
    subject: 'Someone tried to create a Basinwright account with your address',
    text:
      `Hello ${name},\n\n` +
      `Someone tried to create a new Basinwright account with this e-mail address, which already has one. ` +
      `Nothing was changed. To sign in, open ${signIn}; if you forgot your password, open ${reset}.\n\n` +
      `If this was not you, you can ignore this e-mail.\n`,
    html:
      `<p>Hello ${escapeHtml(name)},</p>` +
      `<p>Someone tried to create a new Basinwright account with this e-mail address, which already has one. Nothing was changed.</p>` +
      `<p><a href="${escapeHtml(signIn)}">Sign in</a> or <a href="${escapeHtml(reset)}">choose a new password</a>.</p>` +
      `<p>If this was not you, you can ignore this e-mail.</p>`,
  };
}

/** To an address invited by one firm while it has an account in another (one address, one firm). */
export function invitedElsewhereMail(
  to: string,
  name: string,
  firmName: string,
  inviterName: string,
): MailMessage {
  return {
    to,
    subject: `${firmName} invited you to Basinwright`,
    text:
      `Hello ${name},\n\n${inviterName} invited this address to join ${firmName} on Basinwright. ` +
      `This address already belongs to an account in another firm, and an address can belong to one firm only, ` +
      `so the invitation cannot be accepted with it. If you want to join ${firmName}, ask ${inviterName} to invite another address.\n`,
    html:
      `<p>Hello ${escapeHtml(name)},</p>` +
      `<p>${escapeHtml(inviterName)} invited this address to join <strong>${escapeHtml(firmName)}</strong> on Basinwright. ` +
      `This address already belongs to an account in another firm, and an address can belong to one firm only, ` +
      `so the invitation cannot be accepted with it.</p>` +
      `<p>If you want to join ${escapeHtml(firmName)}, ask ${escapeHtml(inviterName)} to invite another address.</p>`,
  };
}

export function signupMail(to: string, name: string, firmName: string, token: string): MailMessage {
  const url = link('confirm-sign-up', token);
  return {
    to,
    subject: 'Finish creating your Basinwright account',
    text:
      `Hello ${name},\n\n` +
      `To finish creating the Basinwright account of ${firmName}, open:\n\n${url}\n\n` +
      `The link works once and expires in 24 hours. If you did not ask for this, ignore this e-mail.\n`,
    html:
      `<p>Hello ${escapeHtml(name)},</p>` +
      `<p>To finish creating the Basinwright account of <strong>${escapeHtml(firmName)}</strong>:</p>` +
      `<p><a href="${escapeHtml(url)}">Finish creating the account</a></p>` +
      `<p>The link works once and expires in 24 hours. If you did not ask for this, ignore this e-mail.</p>`,
  };
}
