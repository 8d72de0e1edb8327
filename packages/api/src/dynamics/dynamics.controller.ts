import { Body, Controller, Get, Param, Put } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiTags } from '@nestjs/swagger';
import { contextInputSchema } from '@limbus/schema';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { openApiSchema } from '../common/zod-validation.pipe';
import { Roles, TeamMember } from '../teams/roles.decorator';
import { type DynamicsView, DynamicsService, type NoDynamics } from './dynamics.service';

/**
 * A body's physical parameters and the ring fits set against them. The event routes read and write the
 * event's body's document, for the desk's ring strip; the body routes serve the body page.
 */
@ApiTags('dynamics')
@ApiBearerAuth()
@Controller()
export class DynamicsController {
  constructor(private readonly dynamics: DynamicsService) {}

  @Get('bodies/:bodyId/dynamics')
  @TeamMember()
  getForBody(@Param('bodyId') bodyId: string): Promise<DynamicsView | NoDynamics> {
    return this.dynamics.getForBody(bodyId);
  }

  /** The body is a limbus-context-input/1 document; the service validates it with the file's schema. */
  @Put('bodies/:bodyId/dynamics')
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(contextInputSchema) })
  putForBody(
    @CurrentUser() user: AuthUser,
    @Param('bodyId') bodyId: string,
    @Body() document: unknown,
  ): Promise<DynamicsView> {
    return this.dynamics.putForBody(user, bodyId, document);
  }

  @Get('events/:eventId/dynamics')
  @TeamMember()
  getForEvent(@Param('eventId') eventId: string): Promise<DynamicsView | NoDynamics> {
    return this.dynamics.getForEvent(eventId);
  }

  @Put('events/:eventId/dynamics')
  @Roles('coordinator', 'modeller')
  @ApiBody({ schema: openApiSchema(contextInputSchema) })
  putForEvent(
    @CurrentUser() user: AuthUser,
    @Param('eventId') eventId: string,
    @Body() document: unknown,
  ): Promise<DynamicsView> {
    return this.dynamics.putForEvent(user, eventId, document);
  }
}
