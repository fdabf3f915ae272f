/**
 * The SMTP transport (nodemailer) from config.smtp. Locally that is the fake
 * SMTP server of api/src/local/mail-fake.ts; short timeouts so that a server
 * that is down costs a decision seconds at most, never a failure.
 */
import nodemailer from 'nodemailer';
import type { Config } from '../config.ts';

export interface OutgoingMessage {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  /** Where links in messages point (the application's address). */
  appUrl: string;
  send(message: OutgoingMessage): Promise<void>;
}

export function createMailer(config: Config): Mailer {
  const transport = nodemailer.createTransport({
    host: config.smtp.host,
    port: config.smtp.port,
    secure: false,
    // the local fake server offers no TLS; production relays are set up by the operator
    ignoreTLS: config.smtp.host === '127.0.0.1' || config.smtp.host === 'localhost',
    connectionTimeout: 4000,
    greetingTimeout: 4000,
    socketTimeout: 8000,
  });
  return {
    appUrl: config.appUrl.replace(/\/$/, ''),
    async send(message) {
      await transport.sendMail({ from: config.smtp.from, to: message.to, subject: message.subject, text: message.text, html: message.html });
    },
  };
}
