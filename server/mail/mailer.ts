import nodemailer from 'nodemailer';
import { env } from '../env';

export function createTransport(opts: { host?: string; port?: number } = {}) {
  return nodemailer.createTransport({
    host: opts.host ?? env.SMTP_HOST,
    port: opts.port ?? env.SMTP_PORT,
    secure: false,
    ignoreTLS: true, // the local fake speaks plain SMTP on loopback
    connectionTimeout: 5_000,
    greetingTimeout: 5_000,
  });
}
