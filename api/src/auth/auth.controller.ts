import { Controller, Get, HttpCode, Ip, Post, Req, Res, UseGuards } from '@nestjs/common';
import { ApiBody, ApiOperation, ApiTags } from '@nestjs/swagger';
import { type CsrfToken, loginSchema, type SessionUser } from '@keyloom/shared';
import type { Request, Response } from 'express';
import { zodSchemaObject } from '../common/openapi/zod-schema-object';
import { AuthService } from './auth.service';
import { CsrfService } from './csrf.service';
import { CurrentUser } from './decorators/current-user.decorator';
import { Public } from './decorators/public.decorator';
import { SignInRateLimit } from './decorators/sign-in-rate-limit.decorator';
import { LocalAuthGuard } from './guards/local-auth.guard';
import { SESSION_COOKIE } from './session-user';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly auth: AuthService,
    private readonly csrf: CsrfService,
  ) {}

  @Post('login')
  @Public()
  @SignInRateLimit()
  @UseGuards(LocalAuthGuard)
  @HttpCode(200)
  @ApiOperation({ summary: 'Sign in (needs X-CSRF-Token from GET /api/auth/csrf); starts a new session' })
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

  @Get('me')
  @ApiOperation({ summary: 'The signed-in user' })
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
