import { Module } from '@nestjs/common';
import { PassportModule } from '@nestjs/passport';
import { AuditModule } from '../audit/audit.module';
import { UsersModule } from '../users/users.module';
import { AuthController } from './auth.controller';
import { AuthService } from './auth.service';
import { CsrfService } from './csrf.service';
import { SessionSerializer } from './session.serializer';
import { SignInLimitsService } from './sign-in-limits/sign-in-limits.service';
import { LocalStrategy } from './strategies/local.strategy';

// The global guards (SessionGuard, RolesGuard, CsrfGuard) are registered in AppModule, in order.
@Module({
  imports: [PassportModule.register({ session: true }), UsersModule, AuditModule],
  controllers: [AuthController],
  providers: [AuthService, CsrfService, LocalStrategy, SessionSerializer, SignInLimitsService],
  exports: [CsrfService],
})
export class AuthModule {}
