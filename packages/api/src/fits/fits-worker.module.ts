import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { MailModule } from '../mail/mail.module';
import { FitNotices } from './fit-notices';
import { FitsProcessor } from './fits.processor';

/** Imported by the worker entry only, so the API process never consumes jobs. */
@Module({ imports: [AuditModule, MailModule], providers: [FitsProcessor, FitNotices] })
export class FitsWorkerModule {}
