// The local mail catcher: an SMTP server on 127.0.0.1 that accepts every message and stores it as JSON
// under .data/mail/ (one file a message), where the admin's Outbox page and the tests read it.
//   tsx scripts/mail-catcher.ts            (MAIL_PORT, default 1025; MAIL_CATCHER_DIR, default .data/mail)
import fs from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { fileURLToPath } from 'node:url';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

export type CaughtMail = {
  id: string;
  from: string;
  to: string[];
  subject: string;
  receivedAt: string;
  text: string;
  html: string | null;
};

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(a) ? a : a ? [a] : [];
  return list.flatMap((x) => x.value.map((v) => v.address ?? '')).filter(Boolean);
}

/** Start the catcher; resolves once it listens. `close()` stops it. */
export async function startMailCatcher({ port, dir }: { port: number; dir: string }) {
  await fs.mkdir(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    size: 30 * 1024 * 1024,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const id = `${Date.now()}-${randomBytes(4).toString('hex')}`;
          const mail: CaughtMail = {
            id,
            from: parsed.from?.text ?? '',
            to: addresses(parsed.to),
            subject: parsed.subject ?? '(no subject)',
            receivedAt: new Date().toISOString(),
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          };
          const file = path.join(dir, `${id}.json`);
          await fs.writeFile(`${file}.tmp`, JSON.stringify(mail, null, 2));
          await fs.rename(`${file}.tmp`, file);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  return { close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

/** Messages caught so far, oldest first. */
export async function readCaughtMail(dir: string): Promise<CaughtMail[]> {
  const names = (await fs.readdir(dir).catch(() => [] as string[])).filter((n) => n.endsWith('.json')).sort();
  return Promise.all(names.map(async (n) => JSON.parse(await fs.readFile(path.join(dir, n), 'utf8')) as CaughtMail));
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
  const port = Number(process.env.MAIL_PORT ?? 1025);
  const dir = process.env.MAIL_CATCHER_DIR ?? path.join(root, '.data/mail');
  const catcher = await startMailCatcher({ port, dir });
  process.stdout.write(`[stringfield] Mail catcher on smtp://127.0.0.1:${port}, storing messages in ${dir}\n`);
  const stop = () => void catcher.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
