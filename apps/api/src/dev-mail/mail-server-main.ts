import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { startFakeSmtp } from './fake-smtp';

/** Runs the fake mail server and keeps every message as JSON in MAILBOX_DIR for `npm run mail`. */
async function main() {
  const port = Number(process.env['SMTP_PORT'] ?? 2525);
  const dir = path.resolve(process.env['MAILBOX_DIR'] ?? '.data/mailbox');
  mkdirSync(dir, { recursive: true });
  const server = await startFakeSmtp({
    port,
    onMessage: (mail) => {
      writeFileSync(path.join(dir, `${mail.id}.json`), JSON.stringify(mail, null, 2));
      console.log(`[mail] to ${mail.to.join(', ')}: ${mail.subject}`);
    },
  });
  console.log(`[mail] fake mail server on 127.0.0.1:${server.port}, keeping messages in ${dir}`);
  const stop = () => void server.close().then(() => process.exit(0));
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error('[mail] could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
