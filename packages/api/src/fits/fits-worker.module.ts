import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { MailModule } from '../mail/mail.module';
import { QueueModule } from '../queue/queue.module';
import { FitRequeue } from './fit-requeue';
import { FitsProcessor } from './fits.processor';

/** Imported by the worker entry only, so the API process never consumes jobs. */
@Module({
  imports: [AuditModule, MailModule, QueueModule],
  providers: [FitsProcessor, FitRequeue],
})
export class FitsWorkerModule {}
