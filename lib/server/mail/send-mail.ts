import nodemailer, { type Transporter } from "nodemailer";

import { getEnv } from "@/lib/env";

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

let transporter: Transporter | undefined;

function getTransporter(): Transporter {
  const env = getEnv();
  // Local SMTP fake in development and tests: plain SMTP on loopback.
  transporter ??= nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: false,
    ignoreTLS: env.SAGLINE_FAKES === "1",
    connectionTimeout: 5_000,
  });
  return transporter;
}

export async function sendMail(mail: Mail): Promise<void> {
  await getTransporter().sendMail({ from: getEnv().MAIL_FROM, ...mail });
}
