import { Module } from '@nestjs/common';
import { AdminController } from './admin.controller';
import { OutboxService } from './outbox.service';

@Module({ controllers: [AdminController], providers: [OutboxService] })
export class AdminModule {}
