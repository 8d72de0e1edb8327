import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module';
import { FitsModule } from '../fits/fits.module';
import { MailModule } from '../mail/mail.module';
import { TeamsModule } from '../teams/teams.module';
import { ReviewsController } from './reviews.controller';
import { ReviewsService } from './reviews.service';

@Module({
  imports: [TeamsModule, FitsModule, AuditModule, MailModule],
  controllers: [ReviewsController],
  providers: [ReviewsService],
})
export class ReviewsModule {}
