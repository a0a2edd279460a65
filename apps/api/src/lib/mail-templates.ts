import { env } from '../config/env.ts';
import type { OutgoingMail } from './mailer.ts';
import { escapeHtml } from './html.ts';

function layout(title: string, paragraphs: string[], action: { label: string; url: string }): string {
  const body = paragraphs.map((p) => `<p style="margin:0 0 16px">${escapeHtml(p)}</p>`).join('');
  return `<!doctype html><html><body style="margin:0;background:#f6f4ee;font-family:Arial,sans-serif;color:#13201d">
<div style="max-width:560px;margin:0 auto;padding:24px">
<p style="font-size:20px;font-weight:bold;color:#0e4b4f;margin:0 0 24px">Stringfield</p>
<h1 style="font-size:22px;margin:0 0 16px">${escapeHtml(title)}</h1>${body}
<p style="margin:24px 0"><a href="${escapeHtml(action.url)}" style="background:#a8480f;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;font-weight:bold">${escapeHtml(action.label)}</a></p>
<p style="font-size:13px;color:#44524f">If the button does not work, copy this address into your browser:<br>${escapeHtml(action.url)}</p>
</div></body></html>`;
}

export function passwordResetMail(to: string, name: string, token: string): OutgoingMail {
  const url = `${env.APP_URL}/reset-password?token=${encodeURIComponent(token)}`;
  const lines = [
    `Hello ${name},`,
    'Someone (hopefully you) asked to reset the password of your Stringfield account.',
    'The link below works once and expires in 1 hour. If you did not ask for it, ignore this message: your password stays as it is.',
  ];
  return {
    to,
    subject: 'Reset your Stringfield password',
    text: `${lines.join('\n\n')}\n\nReset your password: ${url}\n`,
    html: layout('Reset your password', lines, { label: 'Choose a new password', url }),
  };
}

export function invitationMail(to: string, name: string, roleLabel: string, token: string): OutgoingMail {
  const url = `${env.APP_URL}/reset-password?token=${encodeURIComponent(token)}&invite=1`;
  const lines = [
    `Hello ${name},`,
    `You have been invited to Stringfield as ${roleLabel}.`,
    'Choose a password to finish setting up your account. The link works once and expires in 7 days.',
  ];
  return {
    to,
    subject: 'You are invited to Stringfield',
    text: `${lines.join('\n\n')}\n\nSet your password: ${url}\n`,
    html: layout('Welcome to Stringfield', lines, { label: 'Set your password', url }),
  };
}

type TicketRef = { id: number; number: string; title: string; siteName: string; dueAt: Date; priority: string };

function ticketMail(to: string, subject: string, title: string, lines: string[], ticket: TicketRef): OutgoingMail {
  const url = `${env.APP_URL}/work-orders/${ticket.id}`;
  const facts = [`${ticket.number} · ${ticket.priority} · ${ticket.siteName}`, `Due ${ticket.dueAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`];
  const all = [...lines, ...facts];
  return {
    to,
    subject,
    text: `${all.join('\n\n')}\n\nOpen the ticket: ${url}\n`,
    html: layout(title, all, { label: `Open ${ticket.number}`, url }),
  };
}

export function assignmentMail(to: string, name: string, t: TicketRef): OutgoingMail {
  return ticketMail(to, `${t.number} assigned to you: ${t.title}`, 'A work order is assigned to you', [
    `Hello ${name},`,
    `${t.number} "${t.title}" is yours. Read the strings and symptoms on the ticket before you drive out.`,
    'Work on DC strings only with PPE rated for DC arc flash, rated test leads and lock-out/tag-out; never open a connector under load. Local codes rule.',
  ], t);
}

export function submissionMail(to: string, name: string, technician: string, t: TicketRef): OutgoingMail {
  return ticketMail(to, `${t.number} is waiting for sign-off`, 'A work order is waiting for your sign-off', [
    `Hello ${name},`,
    `${technician} submitted ${t.number} "${t.title}". Review the evidence and sign it off or return it.`,
  ], t);
}

export function returnMail(to: string, name: string, supervisor: string, reason: string, t: TicketRef): OutgoingMail {
  return ticketMail(to, `${t.number} was returned: ${reason.slice(0, 60)}`, 'A work order was returned to you', [
    `Hello ${name},`,
    `${supervisor} returned ${t.number} "${t.title}".`,
    `Reason: ${reason}`,
  ], t);
}

export function overdueMail(to: string, name: string, t: TicketRef): OutgoingMail {
  return ticketMail(to, `${t.number} is overdue`, 'A work order is overdue', [
    `Hello ${name},`,
    `${t.number} "${t.title}" passed its due time and is still open.`,
  ], t);
}

export function closeOutMail(to: string, t: TicketRef, supervisor: string, digest: string): OutgoingMail {
  const url = `${env.APP_URL}/api/work-orders/${t.id}/report.pdf`;
  const lines = [
    'Hello,',
    `${t.number} "${t.title}" at ${t.siteName} was signed off by ${supervisor}.`,
    'The close-out report (PDF) holds the before and after measurements, photos and the sign-off record.',
    `Evidence digest (SHA-256): ${digest}`,
  ];
  return {
    to,
    subject: `${t.number} signed off: close-out report`,
    text: `${lines.join('\n\n')}\n\nDownload the report: ${url}\n`,
    html: layout('Work order signed off', lines, { label: 'Download the close-out report', url }),
  };
}
