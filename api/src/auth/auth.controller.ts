import { Body, Controller, Get, HttpCode, Ip, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ApiBody, ApiOperation, ApiTags } from '@nestjs/swagger';
import {
  type ChangePasswordInput,
  changePasswordSchema,
  type CsrfToken,
  loginSchema,
  type SessionUser,
} from '@keyloom/shared';
import type { Request, Response } from 'express';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { AuthService } from './auth.service';
import { CsrfService } from './csrf.service';
import { ZodValidationPipe } from '../common/pipes/zod-validation.pipe';
import { UsersService } from '../users/users.service';
import { AllowPendingPasswordChange } from './decorators/allow-pending-password-change.decorator';
import { CurrentActor, CurrentUser } from './decorators/current-user.decorator';
import { Public } from './decorators/public.decorator';
import { LocalAuthGuard } from './guards/local-auth.guard';
import { type Actor, SESSION_COOKIE } from './session-user';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly csrf: CsrfService,
    private readonly users: UsersService,
  ) {}

  @Post('login')
  @Public()
  @UseGuards(LocalAuthGuard)
  @HttpCode(200)
  @ApiOperation({
    summary:
      'Sign in (needs X-CSRF-Token from GET /api/auth/csrf); starts a new session. Failed attempts are ' +
      'limited per account and per address: 429 with Retry-After while held back',
  })
  @ApiBody({ schema: zodSchemaObject(loginSchema) })
  async login(@CurrentUser() user: SessionUser, @Ip() ip: string): Promise<SessionUser> {
    await this.auth.signedIn({ ...user, ip });
    return user;
  }

  @Post('logout')
  @Public()
  @HttpCode(204)
  @ApiOperation({ summary: 'Sign out: destroys the session and clears its cookie' })
  async logout(@Req() req: Request, @Res({ passthrough: true }) res: Response): Promise<void> {
    const user = req.user;
    await new Promise<void>((resolve, reject) =>
      req.session.destroy((err: unknown) =>
        err ? reject(err instanceof Error ? err : new Error('Could not end the session.')) : resolve(),
      ),
    );
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    if (user) await this.auth.signedOut({ ...user, ip: req.ip ?? null });
  }

  @Post('password')
  @HttpCode(200)
  @AllowPendingPasswordChange()
  @ApiOperation({ summary: 'Change your own password (current one + new one twice); other sessions end' })
  @ApiBody({ schema: zodSchemaObject(changePasswordSchema) })
  changePassword(
    @CurrentActor() actor: Actor,
    @Body(new ZodValidationPipe(changePasswordSchema)) body: ChangePasswordInput,
    @Req() req: Request,
  ): Promise<SessionUser> {
    return this.users.changeOwnPassword(actor, body, req.sessionID);
  }

  @Get('me')
  @AllowPendingPasswordChange()
  @ApiOperation({ summary: 'The signed-in user (mustChangePassword: true while a new password is due)' })
  me(@CurrentUser() user: SessionUser): SessionUser {
    return user;
  }

  @Get('csrf')
  @Public()
  @ApiOperation({
    summary: "The session's CSRF token; send it back as X-CSRF-Token on POST/PUT/PATCH/DELETE",
  })
  csrfToken(@Req() req: Request): CsrfToken {
    return { token: this.csrf.token(req) };
  }
}
