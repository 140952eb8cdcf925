import nodemailer from 'nodemailer';
import type { Config } from '../config';

/** Real SMTP; locally the SMTP sink on loopback (no TLS on loopback). */
export const createMailTransport = (config: Pick<Config, 'SMTP_HOST' | 'SMTP_PORT'>) =>
  nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: false,
    ignoreTLS: config.SMTP_HOST === '127.0.0.1' || config.SMTP_HOST === 'localhost',
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
  });
