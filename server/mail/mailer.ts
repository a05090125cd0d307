import nodemailer, { type Transporter } from "nodemailer";
import type { Env } from "../env";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  verify(): Promise<boolean>;
  close(): void;
}

export function createMailer(env: Env): Mailer {
  const transport: Transporter = nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ignoreTLS: !env.SMTP_SECURE && env.NODE_ENV !== "production",
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: env.MAIL_FROM, ...mail });
    },
    async verify() {
      try {
        await transport.verify();
        return true;
      } catch {
        return false;
      }
    },
    close: () => transport.close(),
  };
}
