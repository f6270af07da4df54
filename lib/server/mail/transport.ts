import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { getEnv } from "@/lib/env";

export interface MailTransport {
  send(mail: { messageId: string; to: string[]; subject: string; text: string }): Promise<void>;
}

/** nodemailer over SMTP with the settings from the environment. */
export function smtpTransport(overrides: { host?: string; port?: number } = {}): MailTransport {
  const env = getEnv();
  const transporter: Transporter = nodemailer.createTransport({
    host: overrides.host ?? env.SMTP_HOST,
    port: overrides.port ?? env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    ignoreTLS: !env.SMTP_SECURE && env.SMTP_HOST === "127.0.0.1",
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10_000,
  });
  return {
    async send(mail) {
      await transporter.sendMail({
        from: env.MAIL_FROM,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        messageId: mail.messageId,
      });
    },
  };
}
