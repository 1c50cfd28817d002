import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer, type SMTPServerSession } from 'smtp-server';
import type { Readable } from 'node:stream';
import type { DataSource } from 'typeorm';
import { writeTransaction } from '../../write-transaction';
import { ReceivedMessage, type ReceivedHeader } from './received-message.entity';

/** A running local fake SMTP server. */
export interface FakeSmtpServer {
  host: string;
  port: number;
  close: () => Promise<void>;
}

/** Where the local fake SMTP server listens. */
export interface FakeSmtpServerOptions {
  /** 0 picks a free port. */
  port: number;
  host?: string;
  /** When the port is taken, listen on a free one instead of failing (only the app itself sends to it). */
  fallbackToFreePort?: boolean;
}

// Far above any message the product writes; a larger one is refused with 552 rather than stored.
const maxMessageBytes = 10 * 1024 * 1024;

/**
 * Starts the local fake SMTP server (smtp-server on the loopback interface, no TLS, no authentication):
 * every message it receives over SMTP is parsed with mailparser and stored for the Outbox page; nothing is
 * relayed. The SMTP reply is sent only after the message is stored, so an accepted message is never lost.
 *
 * @param dataSource where received messages are stored
 * @param options port and host
 * @throws the listen error (e.g. EADDRINUSE) unless `fallbackToFreePort`
 * @returns the host and the port it listens on, and `close()`
 */
export async function startFakeSmtpServer(dataSource: DataSource, options: FakeSmtpServerOptions): Promise<FakeSmtpServer> {
  const host = options.host ?? '127.0.0.1';
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    disableReverseLookup: true,
    logger: false,
    size: maxMessageBytes,
    banner: 'Kcatalog local mail server: messages are kept for the Outbox page and never relayed',
    onData(stream, session, callback) {
      storeMessage(dataSource, stream, session).then(
        () => callback(),
        (error: unknown) => callback(error instanceof Error ? error : new Error(String(error))),
      );
    },
  });
  // Errors of single connections (a client that hangs up) must not stop the server.
  server.on('error', (error: Error) => console.error('Fake SMTP server:', error.message));

  let port: number;
  try {
    port = await listen(server, options.port, host);
  } catch (error) {
    if (!options.fallbackToFreePort || (error as NodeJS.ErrnoException).code !== 'EADDRINUSE') throw error;
    console.warn(`Port ${options.port} is taken; the local fake SMTP server listens on a free port instead.`);
    port = await listen(server, 0, host);
  }
  return {
    host,
    port,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

function listen(server: SMTPServer, port: number, host: string): Promise<number> {
  return new Promise((resolve, reject) => {
    const onError = (error: Error) => {
      server.server.off('listening', onListening);
      reject(error);
    };
    const onListening = () => {
      server.server.off('error', onError);
      const address = server.server.address();
      resolve(typeof address === 'object' && address ? address.port : port);
    };
    server.server.once('error', onError);
    server.server.once('listening', onListening);
    server.listen(port, host);
  });
}

async function storeMessage(dataSource: DataSource, stream: Readable & { sizeExceeded?: boolean }, session: SMTPServerSession): Promise<void> {
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  if (stream.sizeExceeded) {
    throw Object.assign(new Error(`Message exceeds the limit of ${maxMessageBytes} bytes`), { responseCode: 552 });
  }
  const source = Buffer.concat(chunks);
  // The Outbox shows the parts as sent; mailparser's derived text-as-HTML and link detection are not needed.
  const parsed = await simpleParser(source, { skipTextToHtml: true, skipTextLinks: true, skipHtmlToText: true, skipImageLinks: true });
  const headers: ReceivedHeader[] = parsed.headerLines.map(({ line }) => {
    const unfolded = line.replace(/\r?\n[ \t]+/g, ' ');
    const colon = unfolded.indexOf(':');
    return { name: unfolded.slice(0, colon).trim(), value: unfolded.slice(colon + 1).trim() };
  });
  await writeTransaction(dataSource, (manager) =>
    manager.getRepository(ReceivedMessage).insert({
      messageId: parsed.messageId ?? null,
      envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
      envelopeTo: session.envelope.rcptTo.map((recipient) => recipient.address),
      fromHeader: (parsed.from?.text ?? '').slice(0, 500),
      toHeader: addressText(parsed.to).slice(0, 1000),
      subject: (parsed.subject ?? '').slice(0, 500),
      text: parsed.text ?? '',
      html: parsed.html === false ? null : parsed.html,
      headers,
      sizeBytes: source.length,
    }),
  );
}

function addressText(addresses: AddressObject | AddressObject[] | undefined): string {
  if (!addresses) return '';
  return (Array.isArray(addresses) ? addresses : [addresses]).map((address) => address.text).join(', ');
}
