import { Body, Controller, Get, Param, Put } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { contextInputSchema } from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { type DynamicsView, DynamicsService, type NoDynamics } from './dynamics.service';

@ApiTags('dynamics')
@ApiBearerAuth()
@Controller('events/:eventId/dynamics')
export class DynamicsController {
  constructor(private readonly dynamics: DynamicsService) {}

  @Get()
  @TeamMember()
  get(@Param('eventId') eventId: string): Promise<DynamicsView | NoDynamics> {
    return this.dynamics.get(eventId);
  }

  /** The body is a limbus-context-input/1 document; the service validates it with the file's schema. */
  @Put()
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(contextInputSchema) })
  put(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body() body: unknown,
  ): Promise<DynamicsView> {
    return this.dynamics.put(user, eventId, body);
  }
}
