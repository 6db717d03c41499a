import nodemailer from 'nodemailer';
import type { Config } from '../../config.js';

export type MailTransport = {
  send(message: { from: string; to: string; subject: string; text: string; messageId: string }): Promise<void>;
  close(): void;
};

/** SMTP through nodemailer. The plant relay and the sink are plain SMTP on loopback: no STARTTLS. */
export function smtpTransport(smtp: Config['smtp']): MailTransport {
  const transporter = nodemailer.createTransport({
    host: smtp.host, port: smtp.port, secure: false, ignoreTLS: true,
    connectionTimeout: 5_000, greetingTimeout: 5_000, socketTimeout: 10_000,
  });
  return {
    async send(message) {
      await transporter.sendMail(message);
    },
    close: () => transporter.close(),
  };
}
