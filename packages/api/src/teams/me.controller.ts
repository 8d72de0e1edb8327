import { Controller, Get } from '@nestjs/common';
import { ApiBearerAuth, ApiTags } from '@nestjs/swagger';
import { type AuthUser, CurrentUser } from '../auth/auth-user';
import { type MeView, TeamsService } from './teams.service';

@ApiTags('me')
@ApiBearerAuth()
@Controller('me')
export class MeController {
  constructor(private readonly teams: TeamsService) {}

  @Get()
  me(@CurrentUser() auth: AuthUser): Promise<MeView> {
    return this.teams.me(auth.id);
  }
}
