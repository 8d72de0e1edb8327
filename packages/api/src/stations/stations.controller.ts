import { Body, Controller, Delete, HttpCode, Param, Patch, Post } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import {
  type CreateStationPayload,
  createStationPayloadSchema,
  type PatchStationPayload,
  patchStationPayloadSchema,
} from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import type { StationView } from '../events/views';
import { Roles } from '../teams/roles.decorator';
import { StationsService } from './stations.service';

@ApiTags('stations')
@ApiBearerAuth()
@Controller('events/:eventId/stations')
@Roles('coordinator')
export class StationsController {
  constructor(private readonly stations: StationsService) {}

  @Post()
  @ApiBody({ schema: openApiSchema(createStationPayloadSchema) })
  create(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body(new ZodValidationPipe(createStationPayloadSchema)) body: CreateStationPayload,
  ): Promise<StationView> {
    return this.stations.create(user, eventId, body);
  }

  @Patch(':stationId')
  @ApiBody({ schema: openApiSchema(patchStationPayloadSchema) })
  update(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('stationId') stationId: string,
    @Body(new ZodValidationPipe(patchStationPayloadSchema)) body: PatchStationPayload,
  ): Promise<StationView> {
    return this.stations.update(user, eventId, stationId, body);
  }

  @Delete(':stationId')
  @HttpCode(204)
  async remove(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Param('stationId') stationId: string,
  ): Promise<void> {
    await this.stations.remove(user, eventId, stationId);
  }
}
