import { Module } from '@nestjs/common';
import { FitsModule } from '../fits/fits.module';
import { ExportsController } from './exports.controller';
import { ExportsService } from './exports.service';

/** Figure-ready exports of a stored fit; team access comes from FitsModule's `fitId` resolver. */
@Module({ imports: [FitsModule], controllers: [ExportsController], providers: [ExportsService] })
export class ExportsModule {}
