import { Module } from '@nestjs/common';
import { MailService } from './mail.service';
import { NoticesService } from './notices.service';

@Module({ providers: [MailService, NoticesService], exports: [MailService, NoticesService] })
export class MailModule {}
