import { Inject, Injectable, Logger, OnModuleDestroy } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { createTransport, Transporter } from 'nodemailer';
import { appConfig } from '../config/app.config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

/** Sends e-mail through SMTP_HOST:SMTP_PORT (the local SMTP fake under `npm start`/`npm test`). */
@Injectable()
export class MailService implements OnModuleDestroy {
  private readonly logger = new Logger(MailService.name);
  private readonly transport: Transporter;
  private readonly from: string;

  constructor(@Inject(appConfig.KEY) cfg: ConfigType<typeof appConfig>) {
    this.from = cfg.mailFrom;
    this.transport = createTransport({ host: cfg.smtpHost, port: cfg.smtpPort, secure: false, ignoreTLS: true });
  }

  async send(mail: OutgoingMail): Promise<void> {
    await this.transport.sendMail({ from: this.from, ...mail });
    this.logger.log(`Mail "${mail.subject}" sent to ${mail.to}`);
  }

  onModuleDestroy(): void {
    this.transport.close();
  }
}
