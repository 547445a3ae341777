import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

/** A message received by the fake, as the dev mailbox page lists it. */
export interface ReceivedMail {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface SmtpFake {
  port: number;
  messages: ReceivedMail[];
  /** Resolves with the first message to `to` received after the call, or rejects after `timeoutMs`. */
  waitFor(to: string, predicate?: (m: ReceivedMail) => boolean, timeoutMs?: number): Promise<ReceivedMail>;
  stop(): Promise<void>;
}

/**
 * Local SMTP server on loopback standing in for the mail provider. The package's built-in
 * certificate has expired, so STARTTLS is disabled (senders must set ignoreTLS).
 */
export async function startSmtpFake(port = 0): Promise<SmtpFake> {
  const messages: ReceivedMail[] = [];
  const waiters: (() => void)[] = [];
  let nextId = 1;
  const server = new SMTPServer({
    disabledCommands: ['STARTTLS', 'AUTH'],
    authOptional: true,
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const rcpt = session.envelope.rcptTo.map((r) => r.address.toLowerCase());
          messages.push({
            id: nextId++,
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? '',
            to: rcpt,
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          });
          waiters.splice(0).forEach((w) => w());
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const address = server.server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;

  const waitFor: SmtpFake['waitFor'] = (to, predicate = () => true, timeoutMs = 10_000) => {
    const seen = messages.length;
    const wanted = to.toLowerCase();
    return new Promise((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no mail to ${to} within ${timeoutMs} ms`)), timeoutMs);
      const check = () => {
        const hit = messages.slice(seen).find((m) => m.to.includes(wanted) && predicate(m));
        if (hit) {
          clearTimeout(timer);
          resolve(hit);
        } else waiters.push(check);
      };
      check();
    });
  };

  return {
    port: boundPort,
    messages,
    waitFor,
    stop: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
