// `npm run mail`: lists the e-mails the app sent to the local fake mail server, newest last,
// with their links, so invitations and password resets can be followed in development.
import { existsSync, readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { root } from './lib/provision.mjs';

const dir = path.join(root, '.data', 'mailbox');
const count = Number(process.argv[2] ?? 10);
if (!existsSync(dir) || readdirSync(dir).length === 0) {
  console.log('No e-mail yet. Invite a member or ask for a password reset while `npm start` runs.');
  process.exit(0);
}
const files = readdirSync(dir)
  .filter((f) => f.endsWith('.json'))
  .sort()
  .slice(-count);
for (const file of files) {
  const mail = JSON.parse(readFileSync(path.join(dir, file), 'utf8'));
  console.log(`\n— ${mail.receivedAt}  to ${mail.to.join(', ')}\n  ${mail.subject}\n`);
  console.log(mail.text.replace(/^/gm, '  '));
}
