import { Body, Controller, Delete, Get, HttpCode, Param, Post, Req, Res } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { invitationViewSchema, publicInvitationViewSchema } from '@limbus/schema';
import type { Request, Response } from 'express';
import { z } from 'zod';
import { SessionViewSchema } from '../teams/dto/team.views';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { Public } from '../auth/public.decorator';
import { sendSession, type SessionView } from '../auth/refresh-cookie';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { AppConfig } from '../config/app-config';
import { Roles } from '../teams/roles.decorator';
import {
  type AcceptInvitationDto,
  AcceptInvitationSchema,
  type CreateInvitationDto,
  CreateInvitationSchema,
} from './dto/invitation.dto';
import { type InvitationView, InvitationsService, type PublicInvitationView } from './invitations.service';

@ApiTags('invitations')
@Controller()
export class InvitationsController {
  constructor(
    private readonly invitations: InvitationsService,
    private readonly config: AppConfig,
  ) {}

  @Get('teams/:teamId/invitations')
  @Roles('coordinator')
  @ApiBearerAuth()
  @ApiOkResponse({ schema: openApiSchema(z.array(invitationViewSchema)) })
  list(@Param('teamId') teamId: string): Promise<InvitationView[]> {
    return this.invitations.list(teamId);
  }

  @Post('teams/:teamId/invitations')
  @Roles('coordinator')
  @ApiBearerAuth()
  @ApiBody({ schema: openApiSchema(CreateInvitationSchema) })
  create(
    @Param('teamId') teamId: string,
    @Body(new ZodValidationPipe(CreateInvitationSchema)) body: CreateInvitationDto,
    @CurrentUser() user: AuthUser,
  ): Promise<{ id: string }> {
    return this.invitations.invite(teamId, body.email, body.roles, user.id);
  }

  @Post('teams/:teamId/invitations/:invitationId/resend')
  @Roles('coordinator')
  @HttpCode(200)
  @ApiBearerAuth()
  @ApiOkResponse({ schema: openApiSchema(invitationViewSchema) })
  resend(
    @Param('teamId') teamId: string,
    @Param('invitationId') invitationId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<InvitationView> {
    return this.invitations.resend(teamId, invitationId, user.id);
  }

  @Delete('teams/:teamId/invitations/:invitationId')
  @Roles('coordinator')
  @HttpCode(204)
  @ApiBearerAuth()
  revoke(@Param('teamId') teamId: string, @Param('invitationId') invitationId: string): Promise<void> {
    return this.invitations.revoke(teamId, invitationId);
  }

  @Get('invitations/:token')
  @Public()
  @ApiOkResponse({ schema: openApiSchema(publicInvitationViewSchema) })
  describe(@Param('token') token: string): Promise<PublicInvitationView> {
    return this.invitations.describe(token);
  }

  @Post('invitations/:token/accept')
  @Public()
  @HttpCode(200)
  @ApiBody({ schema: openApiSchema(AcceptInvitationSchema) })
  @ApiOkResponse({
    schema: openApiSchema(SessionViewSchema),
    description: 'Also sets the limbus_refresh and limbus_session cookies',
  })
  async accept(
    @Param('token') token: string,
    @Body(new ZodValidationPipe(AcceptInvitationSchema)) body: AcceptInvitationDto,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ): Promise<SessionView> {
    const session = await this.invitations.accept(token, body.name, body.password, req.ip ?? 'unknown');
    return sendSession(res, session, this.config);
  }
}
