import { Body, Controller, Get, Put } from '@nestjs/common';
import { ApiBearerAuth, ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { meViewSchema, type NoticeSettingsPayload, noticeSettingsPayloadSchema } from '@limbus/schema';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { type MeView, TeamsService } from './teams.service';

@ApiTags('me')
@ApiBearerAuth()
@Controller('me')
export class MeController {
  constructor(private readonly teams: TeamsService) {}

  @Get()
  @ApiOkResponse({ schema: openApiSchema(meViewSchema) })
  me(@CurrentUser() auth: AuthUser): Promise<MeView> {
    return this.teams.me(auth.id);
  }

  /** The e-mail notice kinds the signed-in user turned off; the list replaces the stored one. */
  @Put('notices')
  @ApiBody({ schema: openApiSchema(noticeSettingsPayloadSchema) })
  @ApiOkResponse({ schema: openApiSchema(meViewSchema) })
  notices(
    @CurrentUser() auth: AuthUser,
    @Body(new ZodValidationPipe(noticeSettingsPayloadSchema)) body: NoticeSettingsPayload,
  ): Promise<MeView> {
    return this.teams.setNoticeOptOuts(auth.id, body.optOut);
  }
}
