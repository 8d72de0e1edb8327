import { Body, Controller, HttpCode, Post, Req, Res } from '@nestjs/common';
import { ApiBody, ApiOkResponse, ApiTags } from '@nestjs/swagger';
import { SessionViewSchema } from '../teams/dto/team.views';
import type { Request, Response } from 'express';
import { UnauthorizedError } from '../common/domain-errors';
import { openApiSchema, ZodValidationPipe } from '../common/zod-validation.pipe';
import { AppConfig } from '../config/app-config';
import { AuthService, type Session } from './auth.service';
import {
  type LoginDto,
  LoginSchema,
  type PasswordResetConfirmDto,
  PasswordResetConfirmSchema,
  type PasswordResetRequestDto,
  PasswordResetRequestSchema,
} from './dto/auth.dto';
import { Public } from './public.decorator';
import {
  clearRefreshCookie,
  readRefreshCookie,
  secureCookies,
  sendSession,
  type SessionView,
} from './refresh-cookie';

@ApiTags('auth')
@Public()
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly config: AppConfig,
  ) {}

  @Post('login')
  @HttpCode(200)
  @ApiOkResponse({
    schema: openApiSchema(SessionViewSchema),
    description: 'Also sets the limbus_refresh and limbus_session cookies',
  })
  @ApiBody({ schema: openApiSchema(LoginSchema) })
  async login(
    @Body(new ZodValidationPipe(LoginSchema)) body: LoginDto,
    @Req() req: Request,
    @Res({ passthrough: true }) res: Response,
  ): Promise<SessionView> {
    return this.answer(res, await this.auth.login(body.email, body.password, req.ip ?? 'unknown'));
  }

  @Post('refresh')
  @HttpCode(200)
  @ApiOkResponse({
    schema: openApiSchema(SessionViewSchema),
    description: 'Rotates the limbus_refresh cookie; a 401 clears it and limbus_session',
  })
  async refresh(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<SessionView> {
    let session: Session;
    try {
      session = await this.auth.refresh(readRefreshCookie(req));
    } catch (error) {
      // The cookie is worthless now; without the hint the client stops trying it on every page load.
      if (error instanceof UnauthorizedError) clearRefreshCookie(res, secureCookies(this.config));
      throw error;
    }
    return this.answer(res, session);
  }

  @Post('logout')
  @HttpCode(204)
  async logout(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    await this.auth.logout(readRefreshCookie(req));
    clearRefreshCookie(res, secureCookies(this.config));
  }

  @Post('password-reset')
  @HttpCode(202)
  @ApiBody({ schema: openApiSchema(PasswordResetRequestSchema) })
  async requestReset(
    @Body(new ZodValidationPipe(PasswordResetRequestSchema)) body: PasswordResetRequestDto,
    @Req() req: Request,
  ): Promise<void> {
    await this.auth.requestPasswordReset(body.email, req.ip ?? 'unknown');
  }

  @Post('password-reset/confirm')
  @HttpCode(204)
  @ApiBody({ schema: openApiSchema(PasswordResetConfirmSchema) })
  async confirmReset(
    @Body(new ZodValidationPipe(PasswordResetConfirmSchema)) body: PasswordResetConfirmDto,
  ): Promise<void> {
    await this.auth.confirmPasswordReset(body.token, body.password);
  }

  private answer(res: Response, session: Session): SessionView {
    return sendSession(res, session, this.config);
  }
}
