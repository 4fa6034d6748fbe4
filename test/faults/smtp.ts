// A fake SMTP server in its own process, so the fault runs can stop it and start it again on the same
// port. Prints one JSON line per message received.
import { startFakeSmtp } from '@/server/mail/fake-smtp';

const port = Number(process.argv[2] ?? 0);
startFakeSmtp({ port })
  .then((smtp) => {
    process.stdout.write(`${JSON.stringify({ listening: smtp.port })}\n`);
    let seen = 0;
    setInterval(() => {
      const all = smtp.messages();
      for (const m of all.slice(seen)) process.stdout.write(`${JSON.stringify({ message: { to: m.to, subject: m.subject } })}\n`);
      seen = all.length;
    }, 100);
    process.on('SIGTERM', () => void smtp.close().then(() => process.exit(0)));
  })
  .catch((error: unknown) => {
    process.stderr.write(`fake SMTP could not start: ${String(error)}\n`);
    process.exit(1);
  });
