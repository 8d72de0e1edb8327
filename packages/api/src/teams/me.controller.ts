import { Controller, Get } from '@nestjs/common';
import { ApiBearerAuth, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { openApiSchema } from '../common/zod-validation.pipe';
import { MeViewSchema } from './dto/team.views';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { type MeView, TeamsService } from './teams.service';

@ApiTags('me')
@ApiBearerAuth()
@Controller('me')
export class MeController {
  constructor(private readonly teams: TeamsService) {}

  @Get()
  @ApiOkResponse({ schema: openApiSchema(MeViewSchema) })
  me(@CurrentUser() auth: AuthUser): Promise<MeView> {
    return this.teams.me(auth.id);
  }
}
